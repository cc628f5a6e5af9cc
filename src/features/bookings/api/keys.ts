// Query keys of the bookings feature, general → specific; read through the queryOptions factories.
export const bookingKeys = {
  all: ['bookings'] as const,
  list: (all: boolean) => [...bookingKeys.all, 'list', { all }] as const,
  detail: (id: string) => [...bookingKeys.all, 'detail', id] as const,
};
