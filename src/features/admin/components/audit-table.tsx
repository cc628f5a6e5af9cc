import { createColumnHelper } from '@tanstack/react-table';
import { formatMoney } from '@shared/money';
import { AUDIT_ACTION_LABELS, type AuditEntryView } from '@shared/schemas/admin';
import { DataTable } from './data-table';

const col = createColumnHelper<AuditEntryView>();

function amountsText(entry: AuditEntryView): string {
  const a = entry.amounts;
  if (!a) return '—';
  const parts: string[] = [];
  if (a.heldMinor !== undefined) parts.push(`held ${formatMoney(a.heldMinor, a.currency)}`);
  if (a.songwriterMinor !== undefined) parts.push(`songwriter ${formatMoney(a.songwriterMinor, a.currency)}`);
  if (a.payeesMinor !== undefined) parts.push(`payees ${formatMoney(a.payeesMinor, a.currency)}`);
  return parts.join(' · ');
}

const columns = [
  col.accessor('createdAt', { header: 'When', cell: (c) => new Date(c.getValue()).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) }),
  col.accessor((e) => e.actor.displayName, { id: 'actor', header: 'Who' }),
  col.accessor((e) => AUDIT_ACTION_LABELS[e.action], { id: 'action', header: 'What' }),
  col.accessor('targetLabel', { header: 'Target' }),
  col.accessor(amountsText, { id: 'amounts', header: 'Amounts', enableSorting: false }),
  col.accessor('note', { header: 'Note', enableSorting: false }),
];

export function AuditTable({ entries }: { entries: AuditEntryView[] }) {
  return <DataTable data={entries} columns={columns} caption="Audit log" initialSorting={[{ id: 'createdAt', desc: true }]} rowTestId="audit-row" />;
}
