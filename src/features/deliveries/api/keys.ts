// Query keys of the deliveries feature, general → specific; read through the queryOptions factories.
export const deliveryKeys = {
  all: ['deliveries'] as const,
  forBooking: (bookingId: string) => [...deliveryKeys.all, 'booking', bookingId] as const,
  detail: (id: string) => [...deliveryKeys.all, 'detail', id] as const,
  peaks: (id: string, fileId: string) => [...deliveryKeys.all, 'detail', id, 'peaks', fileId] as const,
};
