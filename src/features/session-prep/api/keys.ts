export const sessionPrepKeys = {
  all: ['session-prep'] as const,
  forBooking: (bookingId: string) => [...sessionPrepKeys.all, bookingId] as const,
};
