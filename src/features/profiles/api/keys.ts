// Query keys of the profiles feature, general → specific; read through the queryOptions factories.
export const profileKeys = {
  all: ['profiles'] as const,
  myDrummer: () => [...profileKeys.all, 'mine', 'drummer'] as const,
  myEngineer: () => [...profileKeys.all, 'mine', 'engineer'] as const,
  drummer: (id: string) => [...profileKeys.all, 'drummer', id] as const,
  engineer: (id: string) => [...profileKeys.all, 'engineer', id] as const,
};
