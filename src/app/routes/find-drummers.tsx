import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { drummerSearchQuerySchema, maxRateToMinor, styleLabel, TZ_BANDS, type DrummerSearchQuery } from '@shared/schemas/profiles';
import { Alert, Button, EmptyState, PageHeader } from '@/components/ui';
import { drummerSearchParams, useDrummerSearch } from '@/features/search/api/search-drummers';
import { DrummerCard } from '@/features/search/components/drummer-card';
import { SearchFilters, type FilterKey } from '@/features/search/components/search-filters';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

/** The URL holds the search, so it can be reloaded and shared; a broken URL falls back to no filters. */
function queryFrom(params: URLSearchParams): { query: DrummerSearchQuery; invalid: boolean } {
  const parsed = drummerSearchQuerySchema.safeParse(Object.fromEntries(params.entries()));
  return parsed.success ? { query: parsed.data, invalid: false } : { query: drummerSearchQuerySchema.parse({}), invalid: true };
}

/** Each active filter in words, with the URL keys that clearing it removes. */
function activeFilters(q: DrummerSearchQuery): Array<{ keys: FilterKey[]; text: string; clear: string }> {
  const out: Array<{ keys: FilterKey[]; text: string; clear: string }> = [];
  if (q.style) out.push({ keys: ['style'], text: `style ${styleLabel(q.style)}`, clear: 'Any style' });
  if (q.maxRate !== undefined && q.currency) out.push({ keys: ['maxRate', 'currency'], text: `rate ≤ ${formatMoney(maxRateToMinor(q.maxRate, q.currency), q.currency)}`, clear: 'Clear the rate filter' });
  if (q.maxTurnaround !== undefined) out.push({ keys: ['maxTurnaround'], text: `turnaround ≤ ${q.maxTurnaround} days`, clear: 'Any turnaround' });
  if (q.takingWork !== undefined) out.push({ keys: ['takingWork'], text: q.takingWork ? 'taking work' : 'booked up', clear: 'Include booked-up drummers' });
  if (q.tzBand) out.push({ keys: ['tzBand'], text: `in ${TZ_BANDS[q.tzBand].label}`, clear: 'Any time zone' });
  return out;
}

export function Component() {
  useDocumentTitle('Find drummers');
  const [params, setParams] = useSearchParams();
  const { query, invalid } = useMemo(() => queryFrom(params), [params]);
  const results = useDrummerSearch(query);
  const filters = activeFilters(query);

  const apply = (values: Record<string, string>) => setParams(new URLSearchParams(values));
  const without = (keys: FilterKey[]) => {
    const next = new URLSearchParams(params);
    for (const k of keys) next.delete(k);
    next.delete('page');
    setParams(next);
  };
  const goTo = (page: number) => setParams(drummerSearchParams({ ...query, page }));
  const total = results.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / query.pageSize));

  return (
    <>
      <PageHeader title="Find drummers" description="Session drummers with their styles, rates and turnaround. Listen to a reel before you invite someone to a brief." />
      <div className="grid gap-6 lg:grid-cols-[18rem_1fr]">
        <SearchFilters key={params.toString()} query={query} onApply={apply} onClear={() => setParams(new URLSearchParams())} />
        <section aria-label="Results" className="space-y-4">
          {invalid ? <Alert tone="warning">Some filters in the address were not understood, so every listed drummer is shown.</Alert> : null}
          <QueryState isPending={results.isPending} error={results.error} retry={() => void results.refetch()} loadingLabel="Searching drummers">
            {() =>
              results.data!.items.length === 0 ? (
                <EmptyState
                  title={query.q || filters.length ? `No drummers match${query.q ? ` “${query.q}”` : ''}${filters.length ? ` with ${filters.map((f) => f.text).join(', ')}` : ''}` : 'No drummers are listed yet'}
                  action={
                    filters.length || query.q ? (
                      <div className="flex flex-wrap gap-2">
                        {filters.map((f) => (
                          <Button key={f.keys[0]} variant="secondary" size="sm" onClick={() => without(f.keys)}>
                            {f.clear}
                          </Button>
                        ))}
                        {query.q ? (
                          <Button variant="secondary" size="sm" onClick={() => without(['q'])}>
                            Search without words
                          </Button>
                        ) : null}
                      </div>
                    ) : undefined
                  }
                >
                  {filters.length || query.q ? 'Loosen one filter at a time, or try fewer or shorter words (a word start like “brush” also finds “brushes”).' : 'Drummers appear here once they publish a profile with a headline.'}
                </EmptyState>
              ) : (
                <>
                  <p className="text-ink-muted" aria-live="polite">
                    {total} {total === 1 ? 'drummer' : 'drummers'}
                    {results.isPlaceholderData ? ' · updating…' : ''}
                  </p>
                  <ul className="grid gap-4" data-testid="drummer-results">
                    {results.data!.items.map((d) => (
                      <li key={d.id}>
                        <DrummerCard drummer={d} />
                      </li>
                    ))}
                  </ul>
                  {pages > 1 ? (
                    <nav aria-label="Pages" className="flex items-center gap-3">
                      <Button variant="secondary" size="sm" disabled={query.page <= 1} onClick={() => goTo(query.page - 1)}>
                        Previous
                      </Button>
                      <span>
                        Page {query.page} of {pages}
                      </span>
                      <Button variant="secondary" size="sm" disabled={query.page >= pages} onClick={() => goTo(query.page + 1)}>
                        Next
                      </Button>
                    </nav>
                  ) : null}
                </>
              )
            }
          </QueryState>
        </section>
      </div>
    </>
  );
}
