import type { FormEvent } from 'react';
import { DRUM_STYLES, RATE_CURRENCIES, SEARCH_SORTS, TZ_BAND_IDS, TZ_BANDS, styleLabel, type DrummerSearchQuery } from '@shared/schemas/profiles';
import { Button, Card, SelectField, TextField } from '@/components/ui';

export const FILTER_KEYS = ['q', 'style', 'maxRate', 'currency', 'maxTurnaround', 'takingWork', 'tzBand', 'sort'] as const;
export type FilterKey = (typeof FILTER_KEYS)[number];

const SORT_LABELS: Record<(typeof SEARCH_SORTS)[number], string> = { best: 'Best match', rate: 'Lowest rate', turnaround: 'Fastest turnaround', rating: 'Best rated' };

/** The filter form: submitting writes every filter into the URL, which is what the results read. */
export function SearchFilters({ query, onApply, onClear }: { query: DrummerSearchQuery; onApply: (values: Record<string, string>) => void; onClear: () => void }) {
  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const values: Record<string, string> = {};
    for (const key of FILTER_KEYS) {
      const v = key === 'takingWork' ? (form.get(key) ? 'true' : '') : String(form.get(key) ?? '').trim();
      if (v) values[key] = v;
    }
    // A currency alone filters nothing useful; it only travels with a maximum rate.
    if (!values.maxRate) delete values.currency;
    // The default order needs no place in a shared link.
    if (values.sort === 'best') delete values.sort;
    onApply(values);
  };
  return (
    <Card>
      <form role="search" aria-label="Find drummers" onSubmit={onSubmit} className="space-y-4">
        <TextField label="Words" name="q" type="search" defaultValue={query.q ?? ''} hint="Name, style, kit, anything in a profile" />
        <SelectField label="Style" name="style" defaultValue={query.style ?? ''} options={[{ value: '', label: 'Any style' }, ...DRUM_STYLES.map((s) => ({ value: s, label: styleLabel(s) }))]} />
        <div className="grid grid-cols-[1fr_6rem] gap-3">
          <TextField label="Rate per song at most" name="maxRate" inputMode="decimal" defaultValue={query.maxRate ?? ''} />
          <SelectField label="Currency" name="currency" defaultValue={query.currency ?? 'USD'} options={RATE_CURRENCIES.map((c) => ({ value: c, label: c }))} />
        </div>
        <TextField label="Turnaround at most (days)" name="maxTurnaround" inputMode="numeric" defaultValue={query.maxTurnaround ?? ''} />
        <SelectField label="Time zone" name="tzBand" defaultValue={query.tzBand ?? ''} options={[{ value: '', label: 'Anywhere' }, ...TZ_BAND_IDS.map((b) => ({ value: b, label: TZ_BANDS[b].label }))]} />
        <label className="flex items-center gap-2">
          <input type="checkbox" name="takingWork" value="true" defaultChecked={query.takingWork === true} className="size-4 accent-brand-700" />
          Only drummers taking work
        </label>
        <SelectField label="Sort by" name="sort" defaultValue={query.sort} options={SEARCH_SORTS.map((s) => ({ value: s, label: SORT_LABELS[s] }))} />
        <div className="flex gap-2">
          <Button type="submit">Search</Button>
          <Button variant="ghost" onClick={onClear}>
            Clear
          </Button>
        </div>
      </form>
    </Card>
  );
}
