import { Alert, Card, Spinner } from '@/components/ui';
import { useSessionPrep } from '../api/get-session-prep';
import { useTickPrepItem } from '../api/tick-prep-item';

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** The prep checklist of a booking with a room; renders nothing for a booking without one. */
export function SessionPrepPanel({ bookingId }: { bookingId: string }) {
  const prep = useSessionPrep(bookingId);
  const tick = useTickPrepItem(bookingId);
  if (prep.isPending) return <Spinner label="Loading the prep checklist" />;
  if (prep.error) return <Alert tone="error">The prep checklist could not be loaded: {prep.error.message}</Alert>;
  const p = prep.data;
  if (!p) return null;
  return (
    <Card className="space-y-3" data-testid="session-prep">
      <h2 className="text-xl font-bold">
        Session prep{p.room ? ` at ${p.room.name}` : ''} <span className="text-sm font-normal text-ink-muted">({p.doneCount} of {p.items.length} done)</span>
      </h2>
      <p className="text-sm text-ink-muted">Common practice before the first take. The drummer and the engineer tick items; everyone on the booking sees who did and when.</p>
      {tick.error ? <Alert tone="error">{tick.error.message}</Alert> : null}
      <ul className="space-y-2">
        {p.items.map((item) => (
          <li key={item.id} className="flex items-start gap-3">
            <input
              id={`prep-${item.id}`}
              type="checkbox"
              className="mt-1 size-4"
              checked={item.done}
              disabled={!p.canTick || tick.isPending}
              onChange={(e) => tick.mutate({ itemId: item.id, done: e.target.checked })}
            />
            <div>
              <label htmlFor={`prep-${item.id}`} className="font-medium">
                {item.label}
              </label>
              <p className="text-sm text-ink-muted">
                {item.why} Usually the {item.usually === 'both' ? 'drummer and engineer' : item.usually}.
                {item.last ? ` ${item.last.done ? 'Ticked' : 'Unticked'} by ${item.last.by.displayName}, ${when(item.last.at)}.` : ''}
              </p>
            </div>
          </li>
        ))}
      </ul>
    </Card>
  );
}
