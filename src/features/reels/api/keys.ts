// Query keys of reel tracks. The track lists themselves live in the profile queries.
export const reelKeys = {
  all: ['reels'] as const,
  peaks: (trackId: string) => [...reelKeys.all, 'peaks', trackId] as const,
};
