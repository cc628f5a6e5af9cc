import type { AppContext } from '../app';
import { profilesSeedStep } from '../features/profiles/profiles.seed';

/** What the seed knows after creating the demo accounts: demo key (e.g. 'mara') → user id. */
export type SeedState = { userIds: Record<string, string>; [k: string]: unknown };

/**
 * Each feature adds its demo data here, in order, through its own services (so the demo obeys the
 * same rules as users do). A step may put what later steps need into the state.
 */
export type SeedStep = { name: string; run(ctx: AppContext, state: SeedState): Promise<void> | void };

// Profiles first: briefs, quotes and threads of later steps point at drummers with profiles and reels.
export const seedSteps: SeedStep[] = [profilesSeedStep];
