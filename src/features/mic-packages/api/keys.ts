// Query keys of the mic-packages feature, general → specific.
export const micPackageKeys = {
  all: ['mic-packages'] as const,
  forRoom: (roomId: string) => [...micPackageKeys.all, 'room', roomId] as const,
  detail: (id: string) => [...micPackageKeys.all, 'detail', id] as const,
};
