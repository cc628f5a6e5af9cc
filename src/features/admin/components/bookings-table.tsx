import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { formatMoney } from '@shared/money';
import type { AdminBookingView } from '@shared/schemas/admin';
import { paths } from '@/config/paths';
import { BookingStatusBadge } from '@/features/bookings/components/booking-status-badge';
import { DataTable } from './data-table';

const col = createColumnHelper<AdminBookingView>();

const columns = [
  col.accessor('songTitle', {
    header: 'Song',
    cell: (c) => (
      <Link to={paths.booking.getHref(c.row.original.id)} className="font-medium text-brand-800 underline">
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('status', { header: 'Status', cell: (c) => <BookingStatusBadge status={c.getValue()} /> }),
  col.accessor('totalMinor', { header: 'Agreed', cell: (c) => <span className="tabular-nums">{formatMoney(c.getValue(), c.row.original.currency)}</span> }),
  col.accessor('songwriter', { header: 'Songwriter' }),
  col.accessor((b) => (b.engineer ? `${b.drummer} with ${b.engineer}` : b.drummer), { id: 'payees', header: 'Drummer / engineer' }),
  col.accessor('updatedAt', { header: 'Last change', cell: (c) => new Date(c.getValue()).toLocaleDateString(undefined, { dateStyle: 'medium' }) }),
  col.display({
    id: 'links',
    header: 'Desk',
    cell: (c) => (
      <span className="flex flex-col gap-1">
        <Link to={paths.adminLedger.getHref(c.row.original.id)} className="text-brand-800 underline">
          Ledger
        </Link>
        {c.row.original.openDisputeId ? (
          <Link to={paths.adminDispute.getHref(c.row.original.openDisputeId)} className="text-brand-800 underline">
            Open dispute
          </Link>
        ) : null}
      </span>
    ),
  }),
];

export function BookingsTable({ bookings }: { bookings: AdminBookingView[] }) {
  return <DataTable data={bookings} columns={columns} caption="Bookings" initialSorting={[{ id: 'updatedAt', desc: true }]} rowTestId="booking-row" />;
}
