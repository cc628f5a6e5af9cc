import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { DISPUTE_OUTCOME_LABELS, DISPUTE_REASON_LABELS, type DisputeView } from '@shared/schemas/disputes';
import { paths } from '@/config/paths';
import { DataTable } from './data-table';

const col = createColumnHelper<DisputeView>();
const day = (iso: string) => new Date(iso).toLocaleDateString(undefined, { dateStyle: 'medium' });

const columns = [
  col.accessor('createdAt', { header: 'Opened', cell: (c) => day(c.getValue()) }),
  col.accessor('songTitle', {
    header: 'Booking',
    cell: (c) => (
      <Link to={paths.adminDispute.getHref(c.row.original.id)} className="font-medium text-brand-800 underline">
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor((d) => DISPUTE_REASON_LABELS[d.reason], { id: 'reason', header: 'Reason' }),
  col.accessor((d) => `${d.openedBy.displayName} (${d.openedBy.role})`, { id: 'openedBy', header: 'Opened by' }),
  col.accessor((d) => (d.outcome ? DISPUTE_OUTCOME_LABELS[d.outcome] : d.settling ? 'Being settled' : 'Open'), { id: 'state', header: 'State' }),
];

/** Oldest first by default: the desk works the queue from its head. */
export function DisputeQueueTable({ disputes, caption }: { disputes: DisputeView[]; caption: string }) {
  return <DataTable data={disputes} columns={columns} caption={caption} initialSorting={[{ id: 'createdAt', desc: false }]} rowTestId="dispute-row" />;
}
