// Query keys of the disputes feature, general → specific; read through the queryOptions factories.
export const disputeKeys = {
  all: ['disputes'] as const,
  forBooking: (bookingId: string) => [...disputeKeys.all, 'booking', bookingId] as const,
};
