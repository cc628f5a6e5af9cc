import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import type { MicPackageView } from '@shared/schemas/mic-packages';
import { paths } from '@/config/paths';
import { Alert, FieldError, Spinner, TextField } from '@/components/ui';
import { useRoomSearch } from '@/features/rooms/api/search-rooms';
import { useRoomPackages } from '@/features/mic-packages/api/get-room-packages';

/** Waits until typing pauses, so the room search is not asked once per key press. */
function useDebounced(value: string, ms: number): string {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}

const optionClasses = 'flex cursor-pointer items-start gap-3 rounded-lg border border-line-strong p-3 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50 has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-70';

function PackageOptions({ roomId, currency, value, onChange }: { roomId: string; currency: string; value: string | null; onChange: (pkg: MicPackageView) => void }) {
  const packages = useRoomPackages(roomId);
  if (packages.isPending) return <Spinner label="Loading the room’s mic packages" />;
  if (packages.error) return <Alert tone="error">The mic packages of this room could not be loaded.</Alert>;
  const offered = packages.data.items.filter((p) => !p.archived);
  if (offered.length === 0) return <p className="text-sm text-ink-muted">This room has no mic packages yet, so it cannot be named on a quote. Pick another room.</p>;
  return (
    <fieldset className="space-y-2">
      <legend className="font-medium">Mic package</legend>
      {offered.map((p) => {
        const otherCurrency = p.currency !== currency;
        return (
          <label key={p.id} className={optionClasses}>
            <input type="radio" name="quote-package" className="mt-1 accent-brand-700" checked={value === p.id} disabled={otherCurrency} onChange={() => onChange(p)} />
            <span>
              <span className="block font-medium">
                {p.name} · {formatMoney(p.priceMinor, p.currency)}
              </span>
              <span className="block text-sm text-ink-muted">
                {p.channels.length} channels by {p.engineerName}
                {otherCurrency ? ` · priced in ${p.currency}, the brief pays in ${currency}` : ''}
              </span>
            </span>
          </label>
        );
      })}
    </fieldset>
  );
}

/**
 * Picks the room and mic package a quote names. The server fills in the engineer and their share from the
 * package, so the drummer never types an account id or a price for someone else.
 */
export function PackagePicker({ currency, value, onChange, error }: { currency: string; value: string | null; onChange: (packageId: string | null, pkg: MicPackageView | null) => void; error?: string }) {
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 300);
  const rooms = useRoomSearch(q ? { q, pageSize: '6' } : { pageSize: '6' });
  const [roomId, setRoomId] = useState<string | null>(null);

  const pickRoom = (id: string) => {
    setRoomId(id);
    onChange(null, null);
  };

  return (
    <div className="space-y-3">
      <TextField label="Find a room" type="search" value={text} onChange={(e) => setText(e.target.value)} hint="Room name, town or engineer" autoComplete="off" />
      {rooms.isPending ? <Spinner label="Searching rooms" /> : null}
      {rooms.error ? <Alert tone="error">The room search did not answer. Try again in a moment.</Alert> : null}
      {rooms.data && rooms.data.items.length === 0 ? (
        <p className="text-sm text-ink-muted">
          No rooms match{q ? ` “${q}”` : ''}. Engineers list theirs under{' '}
          <Link to={paths.rooms.getHref()} className="underline">
            Rooms
          </Link>
          .
        </p>
      ) : null}
      {rooms.data?.items.length ? (
        <fieldset className="space-y-2">
          <legend className="font-medium">Room</legend>
          {rooms.data.items.map((r) => (
            <label key={r.id} className={optionClasses}>
              <input type="radio" name="quote-room" className="mt-1 accent-brand-700" checked={roomId === r.id} onChange={() => pickRoom(r.id)} />
              <span>
                <span className="block font-medium">{r.name}</span>
                <span className="block text-sm text-ink-muted">
                  {r.town} · {r.inputs} inputs · engineer {r.engineerName}
                </span>
              </span>
            </label>
          ))}
        </fieldset>
      ) : null}
      {roomId ? <PackageOptions roomId={roomId} currency={currency} value={value} onChange={(p) => onChange(p.id, p)} /> : null}
      <FieldError message={error} />
    </div>
  );
}
