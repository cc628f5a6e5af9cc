import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Alert, PageHeader } from '@/components/ui';
import { QueryState } from '@/features/briefs/components/query-state';
import { useQuery } from '@tanstack/react-query';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { useDelivery } from '@/features/deliveries/api/get-delivery';
import { bookingDeliveriesQueryOptions } from '@/features/deliveries/api/get-booking-deliveries';
import { CheckReport } from '@/features/deliveries/components/check-report';
import { DeliveryBadge } from '@/features/deliveries/components/deliveries-panel';
import { DownloadsCard } from '@/features/deliveries/components/downloads-card';
import { ReviewRoom } from '@/features/deliveries/components/review-room';
import { UploadPanel } from '@/features/deliveries/components/upload-panel';
import { useDocumentTitle } from '@/lib/use-document-title';

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
                <UploadPanel delivery={d} inputList={list.data?.inputList ?? []} />
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
