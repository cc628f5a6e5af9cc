import { useMemo, useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { openBriefsQuerySchema, type OpenBriefsQuery } from '@shared/schemas/briefs';
import { DRUM_STYLES } from '@shared/schemas/profiles';
import { SUPPORTED_CURRENCIES } from '@shared/money';
import { paths } from '@/config/paths';
import { Alert, Badge, Button, Card, EmptyState, PageHeader, SelectField, TextField } from '@/components/ui';
import { openBriefsSearch, useOpenBriefs } from '@/features/briefs/api/get-open-briefs';
import { budgetMinFromText, budgetMinText } from '@/features/briefs/components/budget-filter';
import { budgetText, dateText, styleLabel, tempoText } from '@/features/briefs/components/format';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

const FILTER_KEYS = ['style', 'budgetMin', 'currency', 'deadlineBefore', 'tempoMin', 'tempoMax'] as const;
const CURRENCY_OPTIONS = SUPPORTED_CURRENCIES.map((c) => ({ value: c, label: c }));

/** The URL holds the filters, so a filtered list can be reloaded and shared; a broken URL falls back to no filters. */
function filtersFrom(params: URLSearchParams): { filters: OpenBriefsQuery; invalid: boolean } {
  const raw = Object.fromEntries([...params.entries()].filter(([k]) => (FILTER_KEYS as readonly string[]).includes(k) || k === 'page'));
  const parsed = openBriefsQuerySchema.safeParse(raw);
  return parsed.success ? { filters: parsed.data, invalid: false } : { filters: {}, invalid: true };
}

export function Component() {
  useDocumentTitle('Open briefs');
  const [params, setParams] = useSearchParams();
  const { filters, invalid } = useMemo(() => filtersFrom(params), [params]);
  const list = useOpenBriefs(filters);
  const page = filters.page ?? 1;
  const [budgetError, setBudgetError] = useState<string | undefined>();
  const filterCurrency = filters.currency ?? 'USD';

  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const next = new URLSearchParams();
    for (const key of FILTER_KEYS) {
      if (key === 'budgetMin' || key === 'currency') continue;
      const value = String(form.get(key) ?? '').trim();
      if (value) next.set(key, value);
    }
    // People type the budget in major units; the address and the API carry minor units with their currency.
    const currency = String(form.get('currency') ?? 'USD');
    const budget = budgetMinFromText(String(form.get('budgetText') ?? ''), currency);
    if (!budget.ok) {
      setBudgetError(budget.message);
      return;
    }
    setBudgetError(undefined);
    if (budget.budgetMin !== undefined) {
      next.set('budgetMin', String(budget.budgetMin));
      next.set('currency', currency);
    }
    setParams(next);
  };
  const goTo = (p: number) => setParams(new URLSearchParams(openBriefsSearch({ ...filters, page: p })));
  const hasFilters = FILTER_KEYS.some((k) => filters[k] !== undefined);

  return (
    <>
      <PageHeader title="Open briefs" description="Songs waiting for a drummer. Briefs you were invited to come first." />
      <div className="grid gap-6 lg:grid-cols-[16rem_1fr]">
        <Card>
          <form onSubmit={onSubmit} className="space-y-4" aria-label="Filter open briefs" key={params.toString()}>
            <SelectField label="Style" name="style" defaultValue={filters.style ?? ''} options={[{ value: '', label: 'Any style' }, ...DRUM_STYLES.map((s) => ({ value: s, label: styleLabel(s) }))]} />
            <div className="space-y-1.5">
              <div className="grid grid-cols-[1fr_6.5rem] items-start gap-3">
                <TextField label="Budget reaches at least" name="budgetText" inputMode="decimal" defaultValue={budgetMinText(filters.budgetMin, filterCurrency)} error={budgetError} />
                <SelectField label="Currency" name="currency" defaultValue={filterCurrency} options={CURRENCY_OPTIONS} />
              </div>
              <p className="text-sm text-ink-muted">In whole units, e.g. 250 or 250.50. Only briefs priced in that currency are shown.</p>
            </div>
            <TextField label="Deadline on or before" name="deadlineBefore" type="date" defaultValue={filters.deadlineBefore ?? ''} />
            <div className="grid grid-cols-2 gap-3">
              <TextField label="Tempo from" name="tempoMin" inputMode="numeric" defaultValue={filters.tempoMin ?? ''} />
              <TextField label="Tempo to" name="tempoMax" inputMode="numeric" defaultValue={filters.tempoMax ?? ''} />
            </div>
            <div className="flex gap-2">
              <Button type="submit">Filter</Button>
              {hasFilters ? (
                <Button variant="ghost" onClick={() => setParams(new URLSearchParams())}>
                  Clear
                </Button>
              ) : null}
            </div>
          </form>
        </Card>
        <div className="space-y-4">
          {invalid ? <Alert tone="warning">Some filters in the address were not understood, so all open briefs are shown.</Alert> : null}
          <QueryState isPending={list.isPending} error={list.error} retry={() => void list.refetch()} loadingLabel="Loading open briefs">
            {() =>
              list.data!.items.length === 0 ? (
                <EmptyState
                  title={hasFilters ? 'No open briefs match these filters' : 'No open briefs right now'}
                  action={hasFilters ? <Button variant="secondary" onClick={() => setParams(new URLSearchParams())}>Show all open briefs</Button> : undefined}
                >
                  {hasFilters ? 'Try a wider tempo range, a later deadline or any style.' : 'New briefs appear here as songwriters publish them; invitations also arrive by mail.'}
                </EmptyState>
              ) : (
                <>
                  <p className="text-ink-muted" aria-live="polite">
                    {list.data!.total} open {list.data!.total === 1 ? 'brief' : 'briefs'}
                  </p>
                  <ul className="grid gap-4">
                    {list.data!.items.map((b) => (
                      <li key={b.id}>
                        <Card>
                          <div className="flex flex-wrap items-center gap-2">
                            <h2 className="text-lg font-bold">
                              <Link to={paths.brief.getHref(b.id)} className="underline-offset-2 hover:underline">
                                {b.songTitle}
                              </Link>
                            </h2>
                            {b.invited ? <Badge tone="accent">Invited</Badge> : null}
                            {b.myQuoteId ? <Badge tone="success">Quoted</Badge> : null}
                          </div>
                          <p className="text-ink-muted">
                            {styleLabel(b.style)} · {tempoText(b)} · {b.songCount} {b.songCount === 1 ? 'song' : 'songs'} · {budgetText(b)} · due {dateText(b.deadline)}
                            {b.needsRoom ? ' · needs a room' : ''}
                          </p>
                          <p className="text-sm text-ink-muted">by {b.songwriterName}</p>
                        </Card>
                      </li>
                    ))}
                  </ul>
                  <nav aria-label="Pages" className="flex items-center gap-3">
                    <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => goTo(page - 1)}>
                      Previous
                    </Button>
                    <span>
                      Page {page} of {Math.max(1, Math.ceil(list.data!.total / list.data!.pageSize))}
                    </span>
                    <Button variant="secondary" size="sm" disabled={page * list.data!.pageSize >= list.data!.total} onClick={() => goTo(page + 1)}>
                      Next
                    </Button>
                  </nav>
                </>
              )
            }
          </QueryState>
        </div>
      </div>
    </>
  );
}
