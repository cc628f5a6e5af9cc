import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../app';
import { assertCan, assertVerified, type CurrentUser } from '../../auth/middleware';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import { deliveryExpectPairs, packagePairs } from '@shared/mic-package';
import {
  micPackageInputSchema,
  validatePackageAgainstRoom,
  type BookingInputList,
  type MicPackageInput,
  type MicPackageList,
  type MicPackageUpdateInput,
  type MicPackageView,
} from '@shared/schemas/mic-packages';
import { createRoomsRepository } from '../rooms/rooms.repository';
import { createMicPackagesRepository, type MicPackageWithRoom } from './mic-packages.repository';

/** The room's rules as field errors, the same shape zod's issues take in the error handler. */
function assertFitsRoom(pkg: Pick<MicPackageInput, 'channels'>, room: { inputs: number }): void {
  const issues = validatePackageAgainstRoom(pkg, room);
  if (issues.length === 0) return;
  const fields: Record<string, string> = {};
  for (const issue of issues) fields[issue.path.join('.')] ??= issue.message;
  throw new AppError('invalid_input', issues[0].message, 400, fields);
}

export function toMicPackageView(row: MicPackageWithRoom, viewer: CurrentUser | null): MicPackageView {
  return {
    id: row.id,
    roomId: row.roomId,
    roomName: row.roomName,
    roomTown: row.roomTown,
    roomInputs: row.roomInputs,
    engineerId: row.engineerId,
    engineerName: row.engineerName,
    name: row.name,
    priceMinor: row.priceMinor,
    currency: row.currency,
    channels: row.channels,
    pairs: packagePairs(row.channels),
    archived: row.archivedAt != null,
    mine: viewer?.id === row.engineerId,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** What a booking keeps of the package (frozen at acceptance; see BookingInputList). */
export function toBookingInputList(row: MicPackageWithRoom): BookingInputList {
  const pairs = packagePairs(row.channels);
  return {
    packageId: row.id,
    packageName: row.name,
    roomId: row.roomId,
    roomName: row.roomName,
    channels: row.channels.map((c) => ({ ...c })),
    pairs,
    checkPairs: deliveryExpectPairs(pairs),
  };
}

export function createMicPackagesService(ctx: Pick<AppContext, 'db'>, clock: () => Date = () => new Date()) {
  const repo = createMicPackagesRepository(ctx.db);
  const roomsRepo = createRoomsRepository(ctx.db);

  /** Packages are public offers; a disabled engineer's are gone for everyone but admins and the owner. */
  function loadVisible(viewer: CurrentUser | null, id: string): MicPackageWithRoom {
    const row = repo.findById(id);
    if (!row) throw notFound('That mic package');
    const privileged = viewer && (viewer.id === row.engineerId || can(viewer.roles, 'read:booking:any'));
    if (row.engineerDisabled && !privileged) throw notFound('That mic package');
    return row;
  }

  function loadOwn(user: CurrentUser, id: string): MicPackageWithRoom {
    const row = loadVisible(user, id);
    if (row.engineerId !== user.id) throw forbidden('Only the engineer who made this package can change it');
    assertCan(user, 'update:room:own', 'Only engineers can change mic packages');
    if (row.archivedAt) throw conflict('package_archived', 'This package has been removed and can no longer be changed');
    return row;
  }

  function loadOwnRoom(user: CurrentUser, roomId: string) {
    const room = roomsRepo.findById(roomId);
    if (!room || (room.engineerDisabled && room.engineerId !== user.id)) throw notFound('That room');
    if (room.engineerId !== user.id) throw forbidden('Only the engineer who listed this room can add packages to it');
    assertCan(user, 'update:room:own', 'Only engineers can make mic packages');
    if (room.archivedAt) throw conflict('room_archived', 'This room has been removed');
    return room;
  }

  return {
    create(user: CurrentUser, roomId: string, input: MicPackageInput): MicPackageView {
      const room = loadOwnRoom(user, roomId);
      assertVerified(user);
      assertFitsRoom(input, room);
      const now = clock();
      const id = randomUUID();
      repo.insert({ id, roomId, engineerId: user.id, ...input, createdAt: now, updatedAt: now });
      return toMicPackageView(repo.findById(id)!, user);
    },

    /**
     * A partial update merged into the stored package and checked as a whole again. A quote already sent keeps
     * its price (the quote froze it); the booking copies the input list as it stands when the quote is accepted.
     */
    update(user: CurrentUser, id: string, patch: MicPackageUpdateInput): MicPackageView {
      const row = loadOwn(user, id);
      const merged = micPackageInputSchema.parse({ name: row.name, priceMinor: row.priceMinor, currency: row.currency, channels: row.channels, ...patch });
      assertFitsRoom(merged, { inputs: row.roomInputs });
      repo.update(id, { ...merged, updatedAt: clock() });
      return toMicPackageView(repo.findById(id)!, user);
    },

    /** Removes the package from offers; refused while a quote waiting for an answer names it. */
    archive(user: CurrentUser, id: string): void {
      loadOwn(user, id);
      const now = clock();
      if (repo.waitingQuoteCount([id], now) > 0) {
        throw conflict('package_on_waiting_quote', 'A quote waiting for an answer names this package; remove it once that quote is answered');
      }
      repo.update(id, { archivedAt: now, updatedAt: now });
    },

    get(viewer: CurrentUser | null, id: string): MicPackageView {
      return toMicPackageView(loadVisible(viewer, id), viewer);
    },

    listForRoom(viewer: CurrentUser | null, roomId: string): MicPackageList {
      const room = roomsRepo.findById(roomId);
      const privileged = viewer && room && (viewer.id === room.engineerId || can(viewer.roles, 'read:booking:any'));
      if (!room || (room.engineerDisabled && !privileged)) throw notFound('That room');
      const items = repo.listForRoom(roomId).map((r) => toMicPackageView(r, viewer));
      return { items, total: items.length };
    },

    listMine(user: CurrentUser): MicPackageList {
      const items = repo.listByEngineer(user.id).map((r) => toMicPackageView(r, user));
      return { items, total: items.length };
    },

    /** For the quotes seam: an offered package (not removed, engineer active), or null. */
    resolve(id: string): MicPackageWithRoom | null {
      const row = repo.findById(id);
      if (!row || row.archivedAt || row.roomArchived || row.engineerDisabled) return null;
      return row;
    },
  };
}
export type MicPackagesService = ReturnType<typeof createMicPackagesService>;
