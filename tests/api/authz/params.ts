import type { Db } from '../../../server/db/client';
import { PREP_ITEM_IDS } from '@shared/schemas/session-prep';

// Which table a path parameter names, read from the segment before it (`/briefs/:id` → briefs). Every
// parameter the app uses must be listed: an unknown one throws, so a new route cannot slip past the
// fuzz and authorization tests with an invented id.
const TABLE_OF_SEGMENT: Record<string, string> = {
  briefs: 'briefs',
  quotes: 'quotes',
  bookings: 'bookings',
  threads: 'threads',
  messages: 'messages',
  rooms: 'rooms',
  photos: 'room_photos',
  'mic-packages': 'mic_packages',
  'reel-tracks': 'reel_tracks',
  deliveries: 'deliveries',
  files: 'delivery_files',
  notes: 'delivery_notes',
  disputes: 'disputes',
  accounts: 'users',
  drummers: 'users',
  engineers: 'users',
};

// Parameters that are not objects but words from a fixed list.
const FIXED_PARAMS: Record<string, string> = { size: 'large', itemId: PREP_ITEM_IDS[0] };

/** The table behind each `:param` of a route path, in order; fixed-word parameters map to null. */
export function paramTables(path: string): { name: string; table: string | null }[] {
  const segments = path.split('/');
  const out: { name: string; table: string | null }[] = [];
  segments.forEach((seg, i) => {
    const m = /^:(\w+)$/.exec(seg);
    if (!m) return;
    if (m[1] in FIXED_PARAMS) return out.push({ name: m[1], table: null });
    const table = TABLE_OF_SEGMENT[segments[i - 1]];
    if (!table) throw new Error(`no table known for :${m[1]} in ${path}; add it to TABLE_OF_SEGMENT`);
    out.push({ name: m[1], table });
  });
  return out;
}

/** Fills a route path with ids of real rows (the first row of each table), or a well-formed id that matches nothing. */
export function fillPath(db: Db, path: string, pick: (table: string) => string | null = (t) => firstId(db, t)): string {
  let filled = path;
  for (const p of paramTables(path)) {
    const value = p.table ? (pick(p.table) ?? '00000000-0000-4000-8000-000000000000') : FIXED_PARAMS[p.name];
    filled = filled.replace(`:${p.name}`, encodeURIComponent(value));
  }
  return filled;
}

export function firstId(db: Db, table: string): string | null {
  const row = db.$client.prepare(`SELECT id FROM "${table}" ORDER BY rowid LIMIT 1`).get() as { id: string } | undefined;
  return row ? String(row.id) : null;
}

/** A checksum of every row of every table: a request that must not write anything leaves it unchanged. */
export function dbChecksum(db: Db, skip: string[] = []): string {
  const tables = (db.$client.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`).all() as { name: string }[])
    .map((r) => r.name)
    .filter((t) => !skip.includes(t));
  const parts: string[] = [];
  for (const t of tables) {
    const rows = db.$client.prepare(`SELECT * FROM "${t}"`).raw().all();
    parts.push(`${t}:${rows.length}:${JSON.stringify(rows, (_k, v) => (typeof v === 'bigint' ? String(v) : Buffer.isBuffer(v) ? v.toString('hex') : v))}`);
  }
  return parts.join('\n');
}
