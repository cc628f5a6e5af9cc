// Query keys of the auth feature, general → specific. Everything else reads them through the
// queryOptions factories, never by retyping the array.
export const authKeys = {
  me: ['me'] as const,
};
