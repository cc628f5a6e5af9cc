import type { QuoteLineItem } from '../../db/schema';
import { AppError } from '../../http/app-error';
import { MoneyError, quoteTotal } from '@shared/money';

export type QuotePrices = {
  perSongFeeMinor: number;
  songCount: number;
  rushFeeMinor: number;
  /** The engineer's share: the price of the named mic package, or the share the drummer named. */
  engineerShareMinor: number;
  packageName: string | null;
};

/** The line items of a quote, built by the server from the prices: per-song fee × songs, rush, package. */
export function buildLineItems(p: QuotePrices): QuoteLineItem[] {
  const items: QuoteLineItem[] = [
    { kind: 'per_song', label: p.songCount === 1 ? 'Drum tracks for the song' : `Drum tracks, per song × ${p.songCount}`, unitAmount: p.perSongFeeMinor, quantity: p.songCount },
  ];
  if (p.engineerShareMinor > 0) {
    items.push({ kind: 'package', label: p.packageName ? `Room and mic package: ${p.packageName}` : 'Room, engineer and mic package', unitAmount: p.engineerShareMinor, quantity: 1 });
  }
  if (p.rushFeeMinor > 0) items.push({ kind: 'rush', label: 'Rush fee', unitAmount: p.rushFeeMinor, quantity: 1 });
  return items;
}

/**
 * The total in integer minor units (shared/money's quoteTotal, which also refuses totals that would not
 * fit one payment with the service fee). The price of an extra revision is quoted beside it, not added:
 * it is only paid if a revision beyond those included is asked for.
 */
export function totalOf(items: QuoteLineItem[], currency: string): number {
  try {
    return quoteTotal(items, currency);
  } catch (err) {
    if (err instanceof MoneyError) throw new AppError('invalid_input', err.message, 400, { perSongFeeMinor: err.message });
    throw err;
  }
}
