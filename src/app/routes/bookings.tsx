import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { paths } from '@/config/paths';
import { Card, EmptyState, PageHeader } from '@/components/ui';
import { useCan } from '@/features/auth/hooks/use-can';
import { useBookings } from '@/features/bookings/api/get-bookings';
import { BookingStatusBadge } from '@/features/bookings/components/booking-status-badge';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('Bookings');
  const isAdmin = useCan('read:booking:any');
  const bookings = useBookings(isAdmin);
  return (
    <>
      <PageHeader title="Bookings" description={isAdmin ? 'Every booking on Kitlane.' : 'Hired jobs you are part of: payment, recording, deliveries and acceptance.'} />
      <QueryState isPending={bookings.isPending} error={bookings.error} retry={() => void bookings.refetch()} loadingLabel="Loading bookings">
        {() =>
          bookings.data!.items.length === 0 ? (
            <EmptyState title="No bookings yet">A booking starts when a songwriter accepts a quote.</EmptyState>
          ) : (
            <ul className="grid gap-3">
              {bookings.data!.items.map((b) => (
                <li key={b.id}>
                  <Card className="flex flex-col gap-2 sm:flex-row sm:items-center sm:justify-between">
                    <div>
                      <h2 className="text-lg font-bold">
                        <Link to={paths.booking.getHref(b.id)} className="underline-offset-2 hover:underline">
                          {b.terms.songTitle}
                        </Link>
                      </h2>
                      <p className="text-ink-muted">
                        {b.songwriter.displayName} with {b.drummer.displayName}
                        {b.engineer ? ` and ${b.engineer.displayName}` : ''} · {formatMoney(b.totalMinor, b.currency)}
                      </p>
                    </div>
                    <BookingStatusBadge status={b.status} />
                  </Card>
                </li>
              ))}
            </ul>
          )
        }
      </QueryState>
    </>
  );
}
