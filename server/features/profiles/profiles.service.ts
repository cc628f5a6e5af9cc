import type { Db } from '../../db/client';
import { assertCan, assertVerified, type CurrentUser } from '../../auth/middleware';
import { notFound } from '../../http/app-error';
import type {
  DrummerProfile,
  DrummerProfileInput,
  EngineerProfile,
  EngineerProfileInput,
  OwnDrummerProfile,
  PublicDrummer,
  PublicEngineer,
} from '@shared/schemas/profiles';
import type { DrummerProfileRow, EngineerProfileRow, ProfilesRepository, ProfileOwner } from './profiles.repository';
import { toReelTrackSummary, type ReelsRepository } from '../reels/reels.repository';
import { standardOffsetMinutes } from './time-zone';

/** The rule search and the public page share: a drummer is visible once published with a headline. */
export function isDrummerListed(row: Pick<DrummerProfileRow, 'published' | 'headline'>): boolean {
  return row.published && row.headline.trim() !== '';
}

/** Engineers have no publish switch: a headline is what makes a profile worth showing. */
export function isEngineerListed(row: Pick<EngineerProfileRow, 'headline'>): boolean {
  return row.headline.trim() !== '';
}

function drummerDefaults(user: Pick<CurrentUser, 'id' | 'timeZone'>): DrummerProfileRow {
  return {
    userId: user.id,
    headline: '',
    bio: '',
    styles: [],
    tags: [],
    kit: '',
    baseRateMinor: 0,
    currency: 'USD',
    turnaroundDays: 7,
    revisionsIncluded: 2,
    takingWork: true,
    town: '',
    country: '',
    timeZone: user.timeZone,
    utcOffsetMinutes: safeOffset(user.timeZone),
    ratingAvg: null,
    ratingCount: 0,
    published: false,
    updatedAt: new Date(0),
  };
}

function safeOffset(timeZone: string): number {
  try {
    return standardOffsetMinutes(timeZone);
  } catch {
    return 0;
  }
}

function toDrummerProfile(row: DrummerProfileRow, displayName: string, saved: boolean): DrummerProfile {
  return {
    userId: row.userId,
    displayName,
    headline: row.headline,
    bio: row.bio,
    styles: row.styles as DrummerProfile['styles'],
    tags: row.tags,
    kit: row.kit,
    baseRateMinor: row.baseRateMinor,
    currency: row.currency as DrummerProfile['currency'],
    turnaroundDays: row.turnaroundDays,
    revisionsIncluded: row.revisionsIncluded,
    takingWork: row.takingWork,
    town: row.town,
    country: row.country,
    timeZone: row.timeZone,
    utcOffsetMinutes: row.utcOffsetMinutes,
    ratingAvg: row.ratingAvg,
    ratingCount: row.ratingCount,
    published: row.published,
    listed: isDrummerListed(row),
    updatedAt: saved ? row.updatedAt.toISOString() : null,
  };
}

function toEngineerProfile(row: EngineerProfileRow, displayName: string, saved: boolean): EngineerProfile {
  return {
    userId: row.userId,
    displayName,
    headline: row.headline,
    bio: row.bio,
    services: row.services as EngineerProfile['services'],
    town: row.town,
    country: row.country,
    timeZone: row.timeZone,
    listed: isEngineerListed(row),
    updatedAt: saved ? row.updatedAt.toISOString() : null,
  };
}

function canSeeUnlisted(viewer: CurrentUser | null, ownerId: string): boolean {
  return !!viewer && (viewer.id === ownerId || viewer.roles.includes('admin'));
}

function visibleOwner(owner: ProfileOwner | undefined, role: 'drummer' | 'engineer'): owner is ProfileOwner {
  return !!owner && !owner.disabledAt && owner.roles.includes(role);
}

export function createProfilesService(deps: { db: Db; repo: ProfilesRepository; reels: ReelsRepository }) {
  const { db, repo, reels } = deps;

  return {
    getOwnDrummer(user: CurrentUser): OwnDrummerProfile {
      assertCan(user, 'update:drummer-profile:own', 'Only drummers have a drummer profile');
      const row = repo.findDrummer(user.id);
      return {
        profile: toDrummerProfile(row ?? drummerDefaults(user), user.displayName, !!row),
        reelTracks: reels.listByDrummer(user.id).map(toReelTrackSummary),
      };
    },

    saveOwnDrummer(user: CurrentUser, input: DrummerProfileInput): OwnDrummerProfile {
      assertCan(user, 'update:drummer-profile:own', 'Only drummers have a drummer profile');
      // Publishing puts the profile in front of songwriters: only for confirmed addresses.
      if (input.published) assertVerified(user);
      db.transaction((tx) => {
        const current = repo.findDrummer(user.id, tx) ?? drummerDefaults(user);
        repo.upsertDrummer(
          { ...current, ...input, userId: user.id, utcOffsetMinutes: standardOffsetMinutes(input.timeZone), updatedAt: new Date() },
          tx,
        );
      });
      return this.getOwnDrummer(user);
    },

    getPublicDrummer(viewer: CurrentUser | null, id: string): PublicDrummer {
      const owner = repo.findOwner(id);
      const row = visibleOwner(owner, 'drummer') ? repo.findDrummer(id) : undefined;
      if (!owner || !row || (!isDrummerListed(row) && !canSeeUnlisted(viewer, id))) throw notFound('That drummer');
      const { published: _p, listed: _l, updatedAt: _u, ...profile } = toDrummerProfile(row, owner.displayName, true);
      const engineer = owner.roles.includes('engineer') ? repo.findEngineer(id) : undefined;
      return {
        ...profile,
        id,
        isEngineer: !!engineer && isEngineerListed(engineer),
        reelTracks: reels.listByDrummer(id).map(toReelTrackSummary),
      };
    },

    getOwnEngineer(user: CurrentUser): { profile: EngineerProfile } {
      assertCan(user, 'update:engineer-profile:own', 'Only engineers have an engineer profile');
      const row = repo.findEngineer(user.id);
      const fallback: EngineerProfileRow = { userId: user.id, headline: '', bio: '', services: [], town: '', country: '', timeZone: user.timeZone, updatedAt: new Date(0) };
      return { profile: toEngineerProfile(row ?? fallback, user.displayName, !!row) };
    },

    saveOwnEngineer(user: CurrentUser, input: EngineerProfileInput): { profile: EngineerProfile } {
      assertCan(user, 'update:engineer-profile:own', 'Only engineers have an engineer profile');
      if (input.headline.trim() !== '') assertVerified(user);
      repo.upsertEngineer({ ...input, userId: user.id, updatedAt: new Date() });
      return this.getOwnEngineer(user);
    },

    getPublicEngineer(viewer: CurrentUser | null, id: string): PublicEngineer {
      const owner = repo.findOwner(id);
      const row = visibleOwner(owner, 'engineer') ? repo.findEngineer(id) : undefined;
      if (!owner || !row || (!isEngineerListed(row) && !canSeeUnlisted(viewer, id))) throw notFound('That engineer');
      const { listed: _l, updatedAt: _u, ...profile } = toEngineerProfile(row, owner.displayName, true);
      const drummer = owner.roles.includes('drummer') ? repo.findDrummer(id) : undefined;
      return { ...profile, id, isDrummer: !!drummer && isDrummerListed(drummer), rooms: [] };
    },
  };
}
export type ProfilesService = ReturnType<typeof createProfilesService>;
