import { formatMoney } from '@shared/money';
import { formatMinutesSeconds, type BriefListItem, type BriefView } from '@shared/schemas/briefs';
import { styleLabel } from '@shared/schemas/profiles';

export function budgetText(b: Pick<BriefListItem, 'budgetMinMinor' | 'budgetMaxMinor' | 'currency'>): string {
  if (b.budgetMinMinor === b.budgetMaxMinor) return formatMoney(b.budgetMaxMinor, b.currency);
  return `${formatMoney(b.budgetMinMinor, b.currency)} – ${formatMoney(b.budgetMaxMinor, b.currency)}`;
}

export function lengthText(b: Pick<BriefView, 'lengthBars' | 'lengthSeconds'>): string {
  if (b.lengthBars != null) return `${b.lengthBars} bars`;
  if (b.lengthSeconds != null) return formatMinutesSeconds(b.lengthSeconds);
  return '—';
}

/** A calendar date (YYYY-MM-DD) written out, without shifting it through a time zone. */
export function dateText(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(Date.UTC(y, m - 1, d)));
}

export function tempoText(b: Pick<BriefListItem, 'tempoBpm' | 'timeSignature'>): string {
  return `${b.tempoBpm} BPM · ${b.timeSignature}`;
}

export { styleLabel };
