import { lazy, Suspense } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, PageHeader, Spinner } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useQuery } from '@tanstack/react-query';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { useDelivery } from '@/features/deliveries/api/get-delivery';
import { bookingDeliveriesQueryOptions } from '@/features/deliveries/api/get-booking-deliveries';
import { CheckReport } from '@/features/deliveries/components/check-report';
import { DeliveryBadge } from '@/features/deliveries/components/deliveries-panel';
import { DownloadsCard } from '@/features/deliveries/components/downloads-card';
import { ReviewRoom } from '@/features/deliveries/components/review-room';
import { useDocumentTitle } from '@/lib/use-document-title';

// Only the drummer or engineer uploading sees this panel; its resumable-upload client stays out of the
// review room's download.
const UploadPanel = lazy(() => import('@/features/deliveries/components/upload-panel').then((m) => ({ default: m.UploadPanel })));

export function Component() {
  const { deliveryId = '' } = useParams();
  const delivery = useDelivery(deliveryId);
  const bookingId = delivery.data?.bookingId ?? '';
  // Both wait for the delivery, which names its booking.
  const booking = useQuery({ ...bookingQueryOptions(bookingId), enabled: !!bookingId });
  const list = useQuery({ ...bookingDeliveriesQueryOptions(bookingId), enabled: !!bookingId });
  const title = booking.data ? `${booking.data.terms.songTitle} · v${delivery.data?.number}` : 'Delivery';
  useDocumentTitle(title);
  return (
    <QueryState isPending={delivery.isPending} error={delivery.error} retry={() => void delivery.refetch()} loadingLabel="Loading the delivery" notFoundText="This delivery does not exist, or it is not shared with you yet.">
      {() => {
        const d = delivery.data!;
        const uploading = d.can.upload;
        return (
          <>
            <PageHeader
              title={title}
              description={
                <span className="flex flex-wrap items-center gap-2">
                  <DeliveryBadge delivery={d} />
                  <span>
                    Delivered by {d.createdBy.displayName} ·{' '}
                    <Link className="underline" to={paths.booking.getHref(d.bookingId)}>
                      the booking
                    </Link>
                  </span>
                </span>
              }
            />
            {d.note ? <p className="mb-4 rounded-lg bg-canvas-sunken px-4 py-3">“{d.note}”</p> : null}
            {d.decision === 'changes_requested' ? <Alert tone="warning" className="mb-4">Changes were asked for on this version.</Alert> : null}
            {uploading ? (
              <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
                <Suspense fallback={<Spinner label="Loading the upload panel" />}>
                  <UploadPanel delivery={d} inputList={list.data?.inputList ?? []} />
                </Suspense>
                <CheckReport check={d.check} />
              </div>
            ) : d.status !== 'ready' ? (
              <CheckReport check={d.check} />
            ) : (
              <div className="grid gap-6 xl:grid-cols-[2fr_1fr]">
                <ReviewRoom delivery={d} />
                <div className="space-y-6">
                  <CheckReport check={d.check} />
                  <DownloadsCard delivery={d} />
                </div>
              </div>
            )}
          </>
        );
      }}
    </QueryState>
  );
}
