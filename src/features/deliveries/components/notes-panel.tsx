import { useState } from 'react';
import { getPart } from '@shared/stems/parts';
import type { DeliveryFileView, DeliveryView } from '@shared/schemas/deliveries';
import { Alert, Button, Card } from '@/components/ui';
import { useAddDeliveryNote, useRemoveDeliveryNote } from '../api/delivery-notes';
import { useAcceptDelivery, useRequestChanges } from '../api/delivery-actions';
import { formatTime } from '../lib/format';

export type PendingNote = { atSec: number; fileId: string | null };

/** Notes on the timeline and the songwriter's answer: request changes (with the notes) or accept. */
export function NotesPanel({
  delivery,
  stems,
  pending,
  onPendingChange,
  onJump,
}: {
  delivery: DeliveryView;
  stems: DeliveryFileView[];
  pending: PendingNote | null;
  onPendingChange: (note: PendingNote | null) => void;
  onJump: (sec: number) => void;
}) {
  const add = useAddDeliveryNote(delivery.id);
  const remove = useRemoveDeliveryNote(delivery.id);
  const requestChanges = useRequestChanges(delivery);
  const accept = useAcceptDelivery(delivery);
  const [body, setBody] = useState('');
  const [message, setMessage] = useState('');
  const [confirmAccept, setConfirmAccept] = useState(false);
  const stemLabel = (fileId: string | null) => {
    const f = stems.find((s) => s.id === fileId);
    return f ? (getPart(f.part ?? '')?.label ?? f.name) : null;
  };
  const drafts = delivery.notes.filter((n) => !n.requestedAt);

  return (
    <Card className="space-y-4" aria-labelledby="notes-title">
      <h2 id="notes-title" className="text-lg font-bold">
        Notes
      </h2>
      {pending && delivery.can.note ? (
        <form
          className="space-y-2 rounded-lg border border-line p-3"
          onSubmit={(e) => {
            e.preventDefault();
            add.mutate(
              { ...pending, body },
              {
                onSuccess: () => {
                  setBody('');
                  onPendingChange(null);
                },
              },
            );
          }}
        >
          <label htmlFor="note-body" className="block font-medium">
            Note at {formatTime(pending.atSec)}
            {stemLabel(pending.fileId) ? ` on ${stemLabel(pending.fileId)}` : ''}
          </label>
          <textarea id="note-body" className="w-full rounded-lg border border-line-strong p-2" rows={2} value={body} onChange={(e) => setBody(e.target.value)} placeholder="What should change here?" />
          {add.error ? <Alert tone="error">{add.error.message}</Alert> : null}
          <div className="flex gap-2">
            <Button type="submit" size="sm" busy={add.isPending} disabled={!body.trim()}>
              Save note
            </Button>
            <Button size="sm" variant="ghost" onClick={() => onPendingChange(null)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : null}
      {delivery.notes.length === 0 ? (
        <p className="text-ink-muted">{delivery.can.note ? 'No notes yet. Click a waveform to leave one.' : 'No notes on this version.'}</p>
      ) : (
        <ol className="space-y-2" aria-label="Notes on the timeline">
          {delivery.notes.map((n) => (
            <li key={n.id} className="flex items-start gap-2">
              <Button size="sm" variant="secondary" onClick={() => onJump(n.atSec)} aria-label={`Jump to ${formatTime(n.atSec)}`}>
                {formatTime(n.atSec)}
              </Button>
              <p className="flex-1">
                {stemLabel(n.fileId) ? <span className="font-medium">{stemLabel(n.fileId)}: </span> : null}
                {n.body}
                {n.requestedAt ? <span className="text-sm text-ink-muted"> · sent</span> : null}
              </p>
              {!n.requestedAt && delivery.can.note ? (
                <Button size="sm" variant="ghost" onClick={() => remove.mutate(n.id)} aria-label={`Remove the note at ${formatTime(n.atSec)}`}>
                  Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ol>
      )}
      {delivery.can.requestChanges || delivery.can.accept ? (
        <div className="space-y-3 border-t border-line pt-4">
          <label htmlFor="change-message" className="block font-medium">
            Message to the drummer (optional)
          </label>
          <textarea id="change-message" className="w-full rounded-lg border border-line-strong p-2" rows={2} value={message} onChange={(e) => setMessage(e.target.value)} />
          {requestChanges.error ? <Alert tone="error">{requestChanges.error.message}</Alert> : null}
          {accept.error ? <Alert tone="error">{accept.error.message}</Alert> : null}
          {requestChanges.data && requestChanges.data.addOnsOutstanding > 0 ? (
            <Alert tone="warning">This goes beyond the included revisions: pay for the extra revision on the booking page so the drummer can start.</Alert>
          ) : null}
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => requestChanges.mutate({ message })} busy={requestChanges.isPending} disabled={drafts.length === 0 && !message.trim()}>
              Request changes{drafts.length > 0 ? ` (${drafts.length} note${drafts.length === 1 ? '' : 's'})` : ''}
            </Button>
            {confirmAccept ? (
              <>
                <Button onClick={() => accept.mutate()} busy={accept.isPending} busyLabel="Releasing…">
                  Yes, accept and release the payment
                </Button>
                <Button variant="ghost" onClick={() => setConfirmAccept(false)}>
                  Not yet
                </Button>
              </>
            ) : (
              <Button onClick={() => setConfirmAccept(true)}>Accept delivery</Button>
            )}
          </div>
        </div>
      ) : null}
    </Card>
  );
}
