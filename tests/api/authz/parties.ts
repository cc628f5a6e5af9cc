import type { Db } from '../../../server/db/client';

// The people who may see a private object: its parties. Admins see everything (the dispute desk). Tables
// not listed are public by design (profiles, reels, rooms, photos, mic packages, reviews) or are briefs,
// whose visibility depends on their state (open briefs are listed for every drummer).
const BOOKING_PARTIES = `SELECT songwriter_id AS u FROM bookings WHERE id = :b UNION SELECT drummer_id FROM bookings WHERE id = :b UNION SELECT engineer_id FROM bookings WHERE id = :b`;

const PARTIES_SQL: Record<string, string> = {
  bookings: BOOKING_PARTIES.replaceAll(':b', ':id'),
  deliveries: BOOKING_PARTIES.replaceAll(':b', '(SELECT booking_id FROM deliveries WHERE id = :id)'),
  disputes: BOOKING_PARTIES.replaceAll(':b', '(SELECT booking_id FROM disputes WHERE id = :id)'),
  threads: `SELECT user_id AS u FROM thread_participants WHERE thread_id = :id`,
  messages: `SELECT user_id AS u FROM thread_participants WHERE thread_id = (SELECT thread_id FROM messages WHERE id = :id)`,
  quotes: `SELECT drummer_id AS u FROM quotes WHERE id = :id UNION SELECT engineer_id FROM quotes WHERE id = :id UNION SELECT songwriter_id FROM briefs WHERE id = (SELECT brief_id FROM quotes WHERE id = :id)`,
};

export const isPrivateTable = (table: string) => table in PARTIES_SQL;

export function partiesOf(db: Db, table: string, id: string): Set<string> {
  const rows = db.$client.prepare(PARTIES_SQL[table]).all({ id }) as { u: string | null }[];
  return new Set(rows.map((r) => r.u).filter((u): u is string => !!u));
}

/** Every private object id with its parties: no response to someone outside them may mention the id. */
export function privateObjects(db: Db): { table: string; id: string; parties: Set<string> }[] {
  const out: { table: string; id: string; parties: Set<string> }[] = [];
  for (const table of Object.keys(PARTIES_SQL)) {
    for (const { id } of db.$client.prepare(`SELECT id FROM "${table}"`).all() as { id: string }[]) out.push({ table, id, parties: partiesOf(db, table, id) });
  }
  return out;
}

/** An object of `table` whose parties include `userId` (the first one), or null. */
export function objectOf(db: Db, table: string, userId: string): string | null {
  for (const { id } of db.$client.prepare(`SELECT id FROM "${table}" ORDER BY rowid`).all() as { id: string }[]) {
    if (partiesOf(db, table, id).has(userId)) return id;
  }
  return null;
}

// Child rows that must belong to the parent object in the same path (/deliveries/:id/files/:fileId).
const CHILD_FK: Record<string, Record<string, string>> = {
  delivery_files: { deliveries: 'delivery_id' },
  delivery_notes: { deliveries: 'delivery_id' },
  room_photos: { rooms: 'room_id' },
};

export function childOf(db: Db, table: string, parentTable: string, parentId: string): string | null {
  const fk = CHILD_FK[table]?.[parentTable];
  if (!fk) return null;
  const row = db.$client.prepare(`SELECT id FROM "${table}" WHERE "${fk}" = ? ORDER BY rowid LIMIT 1`).get(parentId) as { id: string } | undefined;
  return row?.id ?? null;
}
