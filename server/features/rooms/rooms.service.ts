import { randomUUID } from 'node:crypto';
import { rm } from 'node:fs/promises';
import { Readable } from 'node:stream';
import type { AppContext } from '../../app';
import { assertCan, assertVerified, type CurrentUser } from '../../auth/middleware';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import { todayIn } from '@shared/schemas/briefs';
import { TZ_BANDS, majorToMinor } from '@shared/schemas/profiles';
import {
  ROOM_PHOTO_MAX_COUNT,
  roomInputSchema,
  type BlockedDatesInput,
  type RoomAcousticsView,
  type RoomInput,
  type RoomPhotoView,
  type RoomSearchQuery,
  type RoomSearchResult,
  type RoomSummary,
  type RoomUpdateInput,
  type RoomView,
} from '@shared/schemas/rooms';
import { validatePackageAgainstRoom } from '@shared/schemas/mic-packages';
import { inTransaction } from '../briefs/in-transaction';
import { standardOffsetMinutes } from '../profiles/time-zone';
import { createMicPackagesRepository } from '../mic-packages/mic-packages.repository';
import { acousticsOf, searchColumnsOf, toAcousticsView } from './room-acoustics.view';
import { makePhotoVariants, UnreadableImageError } from './room-photos';
import { createRoomsRepository, type RoomPhotoRow, type RoomSearchFilters, type RoomWithCard } from './rooms.repository';

const invalid = (field: string, message: string) => new AppError('invalid_input', message, 400, { [field]: message });

export function roomInputOf(row: RoomWithCard): RoomInput {
  return {
    name: row.name,
    town: row.town,
    timeZone: row.timeZone,
    description: row.description,
    dayRateMinor: row.dayRateMinor,
    halfDayRateMinor: row.halfDayRateMinor,
    currency: row.currency,
    inputs: row.inputs,
    dimensions: row.dimensions,
    surfaces: row.surfaces,
    panels: row.panels,
    openings: row.openings,
  };
}

const photoUrl = (roomId: string, photoId: string, size: 'large' | 'thumb') => `/api/rooms/${roomId}/photos/${photoId}/${size}`;

export function toRoomSummary(row: RoomWithCard): RoomSummary {
  return {
    id: row.id,
    engineerId: row.engineerId,
    engineerName: row.engineerName,
    name: row.name,
    town: row.town,
    timeZone: row.timeZone,
    dayRateMinor: row.dayRateMinor,
    halfDayRateMinor: row.halfDayRateMinor,
    currency: row.currency,
    inputs: row.inputs,
    volumeM3: row.volumeM3,
    floorAreaM2: row.floorAreaM2,
    midRt60Sec: row.midRt60Sec,
    reading: row.reading,
    thumbUrl: row.thumbPhotoId ? photoUrl(row.id, row.thumbPhotoId, 'thumb') : null,
    packageCount: row.packageCount,
    archived: row.archivedAt != null,
  };
}

function toPhotoView(p: RoomPhotoRow): RoomPhotoView {
  return { id: p.id, caption: p.caption, width: p.width, height: p.height, url: photoUrl(p.roomId, p.id, 'large'), thumbUrl: photoUrl(p.roomId, p.id, 'thumb') };
}

/** The validated query string → stored units (minor units, offset minutes). */
export function toRoomSearchFilters(q: RoomSearchQuery): RoomSearchFilters {
  const band = q.tzBand ? TZ_BANDS[q.tzBand] : undefined;
  return {
    words: (q.q ?? '').split(/\s+/).filter(Boolean).slice(0, 8),
    town: q.town || undefined,
    offsetRange: band ? { min: band.minMinutes, max: band.maxMinutes } : undefined,
    minVolumeM3: q.minVolume,
    maxVolumeM3: q.maxVolume,
    rtMinSec: q.rtMin,
    rtMaxSec: q.rtMax,
    currency: q.currency,
    maxDayRateMinor: q.maxDayRate !== undefined && q.currency ? majorToMinor(q.maxDayRate, q.currency) : undefined,
    minInputs: q.minInputs,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  };
}

export type IncomingPhoto = { tmpPath: string };

export function createRoomsService(ctx: Pick<AppContext, 'db' | 'storage' | 'logger'>, clock: () => Date = () => new Date()) {
  const repo = createRoomsRepository(ctx.db);
  const packages = createMicPackagesRepository(ctx.db);

  /** Rooms are public listings; a disabled engineer's rooms are gone for everyone but admins. */
  function loadVisibleRoom(viewer: CurrentUser | null, id: string): RoomWithCard {
    const row = repo.findById(id);
    if (!row) throw notFound('That room');
    const privileged = viewer && (viewer.id === row.engineerId || can(viewer.roles, 'read:booking:any'));
    if (row.engineerDisabled && !privileged) throw notFound('That room');
    return row;
  }

  function loadOwnRoom(user: CurrentUser, id: string, opts: { allowArchived?: boolean } = {}): RoomWithCard {
    const row = loadVisibleRoom(user, id);
    if (row.engineerId !== user.id) throw forbidden('Only the engineer who listed this room can change it');
    assertCan(user, 'update:room:own', 'Only engineers can change rooms');
    if (row.archivedAt && !opts.allowArchived) throw conflict('room_archived', 'This room has been removed and can no longer be changed');
    return row;
  }

  function toView(row: RoomWithCard, viewer: CurrentUser | null): RoomView {
    return {
      ...roomInputOf(row),
      ...toRoomSummary(row),
      photos: repo.photos(row.id).map(toPhotoView),
      blockedDates: repo.blockedDates(row.id),
      mine: viewer?.id === row.engineerId,
      createdAt: row.createdAt.toISOString(),
      updatedAt: row.updatedAt.toISOString(),
    };
  }

  /** Lowering the inputs below what a package of the room uses would break that package. */
  function assertPackagesFit(roomId: string, inputs: number): void {
    for (const pkg of repo.activePackages(roomId)) {
      if (validatePackageAgainstRoom(pkg, { inputs }).length > 0) {
        const highest = Math.max(...pkg.channels.map((c) => c.number));
        throw invalid('inputs', `The package “${pkg.name}” uses ${pkg.channels.length} channels up to input ${highest}; change it before lowering the inputs`);
      }
    }
  }

  function offsetOf(timeZone: string): number {
    try {
      return standardOffsetMinutes(timeZone);
    } catch {
      throw invalid('timeZone', 'That time zone is not known here');
    }
  }

  async function removeStored(keys: string[]): Promise<void> {
    for (const key of keys) await ctx.storage.delete(key).catch((error: unknown) => ctx.logger.error(`could not delete ${key}`, error));
  }

  return {
    create(user: CurrentUser, input: RoomInput): RoomView {
      assertCan(user, 'create:room:own', 'Only engineers can list rooms');
      assertVerified(user);
      const now = clock();
      const id = randomUUID();
      repo.insert({ id, engineerId: user.id, ...input, utcOffsetMinutes: offsetOf(input.timeZone), ...searchColumnsOf(input), createdAt: now, updatedAt: now });
      return toView(repo.findById(id)!, user);
    },

    /** A partial update merged into the stored room, then checked as a whole room again. */
    update(user: CurrentUser, id: string, patch: RoomUpdateInput): RoomView {
      const row = loadOwnRoom(user, id);
      const merged = roomInputSchema.parse({ ...roomInputOf(row), ...patch });
      if (merged.inputs < row.inputs) assertPackagesFit(id, merged.inputs);
      repo.update(id, { ...merged, utcOffsetMinutes: offsetOf(merged.timeZone), ...searchColumnsOf(merged), updatedAt: clock() });
      return toView(repo.findById(id)!, user);
    },

    /** Takes the room and its packages out of search; refused while a waiting quote names one of its packages. */
    archive(user: CurrentUser, id: string): void {
      loadOwnRoom(user, id);
      const now = clock();
      inTransaction(ctx.db, (tx) => {
        const ids = repo.activePackages(id, tx).map((p) => p.id);
        if (packages.waitingQuoteCount(ids, now, tx) > 0) {
          throw conflict('package_on_waiting_quote', 'A quote waiting for an answer names a package of this room; remove the room once it is answered');
        }
        repo.archivePackagesOf(id, now, tx);
        repo.update(id, { archivedAt: now, updatedAt: now }, tx);
      });
    },

    get(viewer: CurrentUser | null, id: string): RoomView {
      return toView(loadVisibleRoom(viewer, id), viewer);
    },

    listMine(user: CurrentUser): { items: RoomSummary[]; total: number } {
      const items = repo.listByEngineer(user.id).map(toRoomSummary);
      return { items, total: items.length };
    },

    search(query: RoomSearchQuery): RoomSearchResult {
      const { items, total } = repo.search(toRoomSearchFilters(query));
      return { items: items.map(toRoomSummary), total };
    },

    acoustics(viewer: CurrentUser | null, id: string): RoomAcousticsView {
      return toAcousticsView(acousticsOf(loadVisibleRoom(viewer, id)));
    },

    /** Replaces the blocked dates from today (in the room's time zone) on; past dates stay as they were. */
    setBlockedDates(user: CurrentUser, id: string, input: BlockedDatesInput): string[] {
      const row = loadOwnRoom(user, id);
      const today = todayIn(row.timeZone, clock());
      inTransaction(ctx.db, (tx) => repo.replaceBlockedDates(id, input.dates, today, tx));
      return repo.blockedDates(id);
    },

    /** Checked before the upload body is read, and again before the photo is stored. */
    assertMayAddPhoto(user: CurrentUser, id: string): void {
      loadOwnRoom(user, id);
      if (repo.countPhotos(id) >= ROOM_PHOTO_MAX_COUNT) throw conflict('photos_full', `A room shows at most ${ROOM_PHOTO_MAX_COUNT} photos. Delete one first.`);
    },

    async addPhoto(user: CurrentUser, id: string, file: IncomingPhoto, caption: string): Promise<RoomPhotoView> {
      const photoId = randomUUID();
      const largeKey = `rooms/${id}/${photoId}.webp`;
      const thumbKey = `rooms/${id}/${photoId}.thumb.webp`;
      let stored: string[] = [];
      try {
        this.assertMayAddPhoto(user, id);
        const variants = await makePhotoVariants(file.tmpPath).catch((error: unknown) => {
          if (error instanceof UnreadableImageError) throw new AppError('unreadable_image', 'That image cannot be read', 422, { file: 'Save the photo again as JPEG, PNG or WebP' });
          throw error;
        });
        await ctx.storage.put(largeKey, Readable.from([variants.large]));
        stored.push(largeKey);
        await ctx.storage.put(thumbKey, Readable.from([variants.thumb]));
        stored.push(thumbKey);
        inTransaction(ctx.db, (tx) => {
          // Two uploads at once must not both take the last place.
          if (repo.countPhotos(id, tx) >= ROOM_PHOTO_MAX_COUNT) throw conflict('photos_full', `A room shows at most ${ROOM_PHOTO_MAX_COUNT} photos.`);
          repo.insertPhoto({ id: photoId, roomId: id, largeKey, thumbKey, width: variants.width, height: variants.height, caption, position: repo.nextPhotoPosition(id, tx), createdAt: clock() }, tx);
        });
        stored = [];
        return toPhotoView(repo.photo(id, photoId)!);
      } finally {
        await rm(file.tmpPath, { force: true });
        await removeStored(stored);
      }
    },

    async deletePhoto(user: CurrentUser, id: string, photoId: string): Promise<void> {
      loadOwnRoom(user, id);
      const photo = repo.photo(id, photoId);
      if (!photo) throw notFound('That photo');
      repo.deletePhoto(id, photoId);
      await removeStored([photo.largeKey, photo.thumbKey]);
    },

    openPhoto(viewer: CurrentUser | null, id: string, photoId: string, size: 'large' | 'thumb'): Readable {
      loadVisibleRoom(viewer, id);
      const photo = repo.photo(id, photoId);
      if (!photo) throw notFound('That photo');
      return ctx.storage.get(size === 'large' ? photo.largeKey : photo.thumbKey);
    },
  };
}
export type RoomsService = ReturnType<typeof createRoomsService>;
