// The deliveries of a booking for the dispute case file. The delivery tables belong to the stem-delivery
// issue and may not exist yet in a given build; the desk reads them when present and says plainly when
// there is nothing, instead of failing. Rows are read by column name so this file does not pin their schema.
import type { Db } from '../../db/client';
import { deliveryCheckReportSchema, type DeliveryCheckReport } from '@shared/schemas/delivery-check';
import type { CaseDelivery } from '@shared/schemas/admin';

export type CaseDeliveries = { available: boolean; items: CaseDelivery[] };

type Row = Record<string, unknown>;

function tableExists(db: Db, name: string): boolean {
  return !!db.$client.prepare("select 1 from sqlite_master where type = 'table' and name = ?").get(name);
}

function columnsOf(db: Db, table: string): Set<string> {
  return new Set((db.$client.prepare(`pragma table_info(${table})`).all() as { name: string }[]).map((c) => c.name));
}

function firstOf(row: Row, keys: string[]): unknown {
  for (const key of keys) if (row[key] !== undefined && row[key] !== null) return row[key];
  return null;
}

function asDate(value: unknown): string | null {
  if (typeof value === 'number') return new Date(value).toISOString();
  if (typeof value === 'string' && !Number.isNaN(Date.parse(value))) return new Date(value).toISOString();
  return null;
}

/** The first JSON column of a check row that is a whole delivery check report. */
function reportIn(row: Row): DeliveryCheckReport | null {
  for (const value of Object.values(row)) {
    if (typeof value !== 'string' || !value.startsWith('{')) continue;
    try {
      const parsed = deliveryCheckReportSchema.safeParse(JSON.parse(value));
      if (parsed.success) return parsed.data;
    } catch {
      // Not JSON after all: look at the next column.
    }
  }
  return null;
}

export function readCaseDeliveries(db: Db, bookingId: string): CaseDeliveries {
  if (!tableExists(db, 'deliveries') || !columnsOf(db, 'deliveries').has('booking_id')) return { available: false, items: [] };
  const rows = db.$client.prepare('select * from deliveries where booking_id = ? order by rowid').all(bookingId) as Row[];
  const checks = tableExists(db, 'delivery_checks') && columnsOf(db, 'delivery_checks').has('delivery_id');
  const checkOf = checks ? db.$client.prepare('select * from delivery_checks where delivery_id = ? order by rowid desc') : null;
  return {
    available: true,
    items: rows.map((row) => {
      const id = String(row.id);
      const checkRows = (checkOf?.all(id) as Row[] | undefined) ?? [];
      const reportColumn = reportIn(row);
      return {
        id,
        number: Number(firstOf(row, ['number', 'version', 'seq'])) || null,
        status: (firstOf(row, ['status']) as string | null) ?? null,
        createdAt: asDate(firstOf(row, ['created_at', 'submitted_at'])),
        report: checkRows.map(reportIn).find((r) => r !== null) ?? reportColumn,
      };
    }),
  };
}
