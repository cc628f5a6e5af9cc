import { useSearchParams } from 'react-router-dom';
import { SUPPORTED_CURRENCIES } from '@shared/money';
import { TZ_BAND_IDS, TZ_BANDS } from '@shared/schemas/profiles';
import { paths } from '@/config/paths';
import { Button, ButtonLink, EmptyState, PageHeader, SelectField, TextField } from '@/components/ui';
import { useCan } from '@/features/auth/hooks/use-can';
import { QueryState } from '@/features/briefs/components/query-state';
import { useRoomSearch } from '@/features/rooms/api/search-rooms';
import { RoomCard } from '@/features/rooms/components/room-card';
import { useDocumentTitle } from '@/lib/use-document-title';

const FILTER_KEYS = ['q', 'town', 'tzBand', 'minVolume', 'rtMin', 'rtMax', 'maxDayRate', 'currency', 'minInputs', 'page'] as const;

export function Component() {
  useDocumentTitle('Rooms');
  const [params, setParams] = useSearchParams();
  const filters = Object.fromEntries(FILTER_KEYS.map((k) => [k, params.get(k) ?? '']).filter(([, v]) => v !== ''));
  const search = useRoomSearch(filters);
  const canList = useCan('create:room:own');
  const page = Number(filters.page ?? '1');
  return (
    <>
      <PageHeader
        title="Rooms"
        description="Rooms and mic packages engineers offer for drum sessions, with an estimate of how each one sounds."
        actions={canList ? <ButtonLink to={paths.newRoom.getHref()}>List a room</ButtonLink> : undefined}
      />
      <form
        className="mb-6 grid gap-3 rounded-2xl border border-line bg-canvas-raised p-4 sm:grid-cols-3 lg:grid-cols-5"
        onSubmit={(e) => {
          e.preventDefault();
          const data = new FormData(e.currentTarget);
          const next = new URLSearchParams();
          for (const k of FILTER_KEYS) {
            const v = String(data.get(k) ?? '').trim();
            if (v && k !== 'page') next.set(k, v);
          }
          setParams(next);
        }}
      >
        <TextField label="Words" name="q" defaultValue={filters.q ?? ''} />
        <TextField label="Town" name="town" defaultValue={filters.town ?? ''} />
        <SelectField label="Time zone band" name="tzBand" defaultValue={filters.tzBand ?? ''} options={[{ value: '', label: 'Any' }, ...TZ_BAND_IDS.map((b) => ({ value: b, label: TZ_BANDS[b].label }))]} />
        <TextField label="Smallest volume (m³)" name="minVolume" inputMode="decimal" defaultValue={filters.minVolume ?? ''} />
        <TextField label="Fewest inputs" name="minInputs" inputMode="numeric" defaultValue={filters.minInputs ?? ''} />
        <TextField label="Shortest RT60 (s)" name="rtMin" inputMode="decimal" defaultValue={filters.rtMin ?? ''} />
        <TextField label="Longest RT60 (s)" name="rtMax" inputMode="decimal" defaultValue={filters.rtMax ?? ''} />
        <TextField label="Highest day rate" name="maxDayRate" inputMode="decimal" defaultValue={filters.maxDayRate ?? ''} />
        <SelectField label="Currency" name="currency" defaultValue={filters.currency ?? ''} options={[{ value: '', label: 'Any' }, ...SUPPORTED_CURRENCIES.map((c) => ({ value: c, label: c }))]} />
        <div className="flex items-end">
          <Button type="submit">Search</Button>
        </div>
      </form>
      <QueryState isPending={search.isPending} error={search.error} retry={() => void search.refetch()} loadingLabel="Searching rooms">
        {() =>
          search.data!.items.length === 0 ? (
            <EmptyState title="No rooms match">Try fewer filters, or a wider reverberation range.</EmptyState>
          ) : (
            <div className="space-y-3">
              <p aria-live="polite">
                {search.data!.total} room{search.data!.total === 1 ? '' : 's'}
              </p>
              <ul className="space-y-3">
                {search.data!.items.map((r) => (
                  <li key={r.id}>
                    <RoomCard room={r} />
                  </li>
                ))}
              </ul>
              <div className="flex gap-2">
                {page > 1 ? (
                  <Button variant="secondary" size="sm" onClick={() => setParams({ ...filters, page: String(page - 1) })}>
                    Previous page
                  </Button>
                ) : null}
                {page * 20 < search.data!.total ? (
                  <Button variant="secondary" size="sm" onClick={() => setParams({ ...filters, page: String(page + 1) })}>
                    Next page
                  </Button>
                ) : null}
              </div>
            </div>
          )
        }
      </QueryState>
    </>
  );
}
