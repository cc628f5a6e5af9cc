import { useDeferredValue, useState } from 'react';
import { BOOKING_STATUSES, BOOKING_STATUS_LABELS } from '@shared/schemas/bookings';
import { EmptyState, PageHeader, SelectField, TextField } from '@/components/ui';
import { AdminNav } from '@/features/admin/components/admin-nav';
import { BookingsTable } from '@/features/admin/components/bookings-table';
import { BOOKING_LIST_LIMIT, useAdminBookings } from '@/features/admin/api/get-admin-bookings';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

const STATUS_OPTIONS = [{ value: '', label: 'Any status' }, ...BOOKING_STATUSES.map((s) => ({ value: s, label: BOOKING_STATUS_LABELS[s] }))];

export function Component() {
  useDocumentTitle('Bookings search');
  const [q, setQ] = useState('');
  const [status, setStatus] = useState('');
  const query = useDeferredValue(q.trim());
  const bookings = useAdminBookings(query, status);
  return (
    <>
      <PageHeader title="Bookings" description="Search every booking by song, party name or email, or booking id." />
      <AdminNav />
      <div className="mb-4 grid max-w-2xl gap-4 sm:grid-cols-2">
        <TextField label="Search" type="search" value={q} onChange={(e) => setQ(e.target.value)} />
        <SelectField label="Status" options={STATUS_OPTIONS} value={status} onChange={(e) => setStatus(e.target.value)} />
      </div>
      <QueryState isPending={bookings.isPending} error={bookings.error} retry={() => void bookings.refetch()} loadingLabel="Loading bookings">
        {() =>
          bookings.data!.items.length === 0 ? (
            <EmptyState title="No booking matches" />
          ) : (
            <>
              <BookingsTable bookings={bookings.data!.items} />
              {bookings.data!.total > BOOKING_LIST_LIMIT ? <p className="mt-2 text-sm text-ink-muted">Showing {BOOKING_LIST_LIMIT} of {bookings.data!.total}; narrow the search.</p> : null}
            </>
          )
        }
      </QueryState>
    </>
  );
}
