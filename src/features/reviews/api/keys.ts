// Query keys of the reviews feature, general → specific; read through the queryOptions factories.
export const reviewKeys = {
  all: ['reviews'] as const,
  forBooking: (bookingId: string) => [...reviewKeys.all, 'booking', bookingId] as const,
  forProfile: (role: 'drummer' | 'engineer', personId: string) => [...reviewKeys.all, 'profile', role, personId] as const,
};
