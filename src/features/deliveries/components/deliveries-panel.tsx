import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { DELIVERY_STATUS_LABELS, type DeliveryView } from '@shared/schemas/deliveries';
import { paths } from '@/config/paths';
import { Alert, Badge, Button, ButtonLink, Card, Spinner } from '@/components/ui';
import { useBookingDeliveries } from '../api/get-booking-deliveries';
import { useCreateDelivery } from '../api/create-delivery';

/** On the booking page: every version delivered so far, and for the drummer or engineer a way to start the next. */
export function DeliveriesPanel({ bookingId }: { bookingId: string }) {
  const list = useBookingDeliveries(bookingId);
  const create = useCreateDelivery(bookingId);
  const navigate = useNavigate();
  const [note, setNote] = useState('');

  if (list.isPending) return <Spinner label="Loading deliveries" />;
  if (list.error) return <Alert tone="error">The deliveries could not be loaded: {list.error.message}</Alert>;
  const { items, canCreate, createBlockedBy } = list.data;
  const next = (items[0]?.number ?? 0) + 1;
  return (
    <Card className="my-6 space-y-4" aria-labelledby="deliveries-title">
      <h2 id="deliveries-title" className="text-lg font-bold">
        Deliveries
      </h2>
      {items.length === 0 ? <p className="text-ink-muted">No stems delivered yet.</p> : null}
      {items.length > 0 ? (
        <ul className="divide-y divide-line">
          {items.map((d) => (
            <li key={d.id} className="flex flex-wrap items-center gap-3 py-2">
              <span className="font-medium">v{d.number}</span>
              <DeliveryBadge delivery={d} />
              <span className="text-sm text-ink-muted">{d.files.length} files</span>
              {d.check.report ? <span className="text-sm">{d.check.report.summary}</span> : null}
              <ButtonLink to={paths.delivery.getHref(d.id)} size="sm" variant="secondary" className="ml-auto">
                {d.submittedAt ? 'Open the review room' : 'Open'} <span className="sr-only">v{d.number}</span>
              </ButtonLink>
            </li>
          ))}
        </ul>
      ) : null}
      {canCreate ? (
        <form
          className="space-y-2 border-t border-line pt-4"
          onSubmit={(e) => {
            e.preventDefault();
            create.mutate({ note }, { onSuccess: (d) => navigate(paths.delivery.getHref(d.id)) });
          }}
        >
          <label htmlFor="delivery-note" className="block font-medium">
            Note for v{next} (optional)
          </label>
          <textarea id="delivery-note" rows={2} className="w-full rounded-lg border border-line-strong p-2" value={note} onChange={(e) => setNote(e.target.value)} />
          {create.error ? <Alert tone="error">{create.error.message}</Alert> : null}
          <Button type="submit" busy={create.isPending}>
            Start delivery v{next}
          </Button>
        </form>
      ) : createBlockedBy && list.data.items.every((d) => d.submittedAt) && !/Only the booking/.test(createBlockedBy) ? (
        <p className="text-sm text-ink-muted">{createBlockedBy}</p>
      ) : null}
    </Card>
  );
}

export function DeliveryBadge({ delivery }: { delivery: DeliveryView }) {
  if (delivery.decision === 'accepted') return <Badge tone="success">Accepted</Badge>;
  if (delivery.decision === 'changes_requested') return <Badge tone="accent">Changes requested</Badge>;
  if (delivery.submittedAt) return <Badge tone="brand">Submitted</Badge>;
  return <Badge>{DELIVERY_STATUS_LABELS[delivery.status]}</Badge>;
}
