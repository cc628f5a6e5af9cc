// Query keys of the payments feature, general → specific; read through the queryOptions factories.
export const paymentKeys = {
  all: ['payments'] as const,
  money: (bookingId: string) => [...paymentKeys.all, 'money', bookingId] as const,
  payoutAccount: () => [...paymentKeys.all, 'payout-account'] as const,
  publishableKey: () => [...paymentKeys.all, 'publishable-key'] as const,
};
