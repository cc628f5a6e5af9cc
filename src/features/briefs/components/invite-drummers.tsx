import { useEffect, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { SEARCH_PAGE_SIZE, styleLabel, type DrummerSearchItem } from '@shared/schemas/profiles';
import type { BriefView } from '@shared/schemas/briefs';
import { paths } from '@/config/paths';
import { Alert, Button, Spinner, TextField } from '@/components/ui';
import { useDrummerSearch } from '@/features/search/api/search-drummers';
import { useInviteDrummers } from '../api/invite-drummers';

/** Waits until typing pauses, so the search is not asked once per key press. */
function useDebounced(value: string, ms: number): string {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}

function CandidateRow({ drummer, invited, busy, onInvite }: { drummer: DrummerSearchItem; invited: boolean; busy: boolean; onInvite: () => void }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 py-2">
      <span className="min-w-0">
        <Link to={paths.drummer.getHref(drummer.id)} className="font-medium underline-offset-2 hover:underline">
          {drummer.displayName}
        </Link>
        <span className="block text-sm text-ink-muted">
          {drummer.styles.slice(0, 3).map(styleLabel).join(', ')} · {formatMoney(drummer.baseRateMinor, drummer.currency)} per song
          {drummer.takingWork ? '' : ' · booked up'}
        </span>
      </span>
      {invited ? (
        <span className="text-sm font-medium text-success-700">Invited</span>
      ) : (
        <Button size="sm" variant="secondary" busy={busy} busyLabel="Inviting…" onClick={onInvite} aria-label={`Invite ${drummer.displayName}`}>
          Invite
        </Button>
      )}
    </li>
  );
}

/**
 * The brief owner's "Invite drummers" picker: search drummers by name, style or kit and invite them one
 * by one. An invited drummer sees the brief first in their list and gets a notification.
 */
export function InviteDrummers({ brief }: { brief: BriefView }) {
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 300);
  const search = useDrummerSearch({ q: q || undefined, sort: 'best', page: 1, pageSize: Math.min(8, SEARCH_PAGE_SIZE) });
  const invite = useInviteDrummers();
  const [pendingId, setPendingId] = useState<string | null>(null);
  const invited = brief.invitedDrummers ?? [];
  const invitedIds = new Set(invited.map((d) => d.id));
  // The search lists everyone published, including the owner when they also drum; they cannot invite themselves.
  const candidates = (search.data?.items ?? []).filter((d) => d.id !== brief.songwriterId);

  const onInvite = (drummerId: string) => {
    setPendingId(drummerId);
    invite.mutate({ id: brief.id, drummerIds: [drummerId] }, { onSettled: () => setPendingId(null) });
  };
  const onSubmit = (e: FormEvent) => e.preventDefault();

  return (
    <section aria-labelledby="invite-heading" className="space-y-3 border-t border-line pt-4">
      <h3 id="invite-heading" className="text-lg font-bold">
        Invite drummers
      </h3>
      {invited.length ? (
        <div>
          <p className="text-sm font-medium">Invited so far</p>
          <ul className="mt-1 flex flex-wrap gap-2" aria-label="Invited drummers">
            {invited.map((d) => (
              <li key={d.id} className="rounded-full bg-canvas-sunken px-3 py-1 text-sm">
                {d.displayName}
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="text-sm text-ink-muted">Nobody invited yet. Invited drummers see your brief first and are told by mail.</p>
      )}
      <form role="search" onSubmit={onSubmit}>
        <TextField label="Find a drummer" type="search" value={text} onChange={(e) => setText(e.target.value)} hint="Name, style or kit" autoComplete="off" />
      </form>
      {invite.error ? <Alert tone="error">{invite.error.message}</Alert> : null}
      {search.isPending ? <Spinner label="Searching drummers" /> : null}
      {search.error ? <Alert tone="error">The drummer search did not answer. Try again in a moment.</Alert> : null}
      {search.data && candidates.length === 0 ? <p className="text-sm text-ink-muted">No drummers match “{q}”.</p> : null}
      {candidates.length ? (
        <ul className="divide-y divide-line" aria-label="Drummers you can invite" aria-busy={search.isFetching}>
          {candidates.map((d) => (
            <CandidateRow key={d.id} drummer={d} invited={invitedIds.has(d.id)} busy={pendingId === d.id} onInvite={() => onInvite(d.id)} />
          ))}
        </ul>
      ) : null}
    </section>
  );
}
