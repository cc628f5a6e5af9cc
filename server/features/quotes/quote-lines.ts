import type { QuoteLineItem } from '../../db/schema';
import { AppError } from '../../http/app-error';
import { MAX_AMOUNT_MINOR } from '@shared/schemas/briefs';

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
 * The total in integer minor units. The price of an extra revision is quoted beside it, not added:
 * it is only paid if a revision beyond those included is asked for.
 */
export function totalOf(items: QuoteLineItem[]): number {
  let total = 0;
  for (const item of items) {
    if (!Number.isSafeInteger(item.unitAmount) || !Number.isSafeInteger(item.quantity) || item.unitAmount < 0 || item.quantity < 0) {
      throw new Error(`line item "${item.label}" is not whole minor units`);
    }
    total += item.unitAmount * item.quantity;
  }
  if (total > MAX_AMOUNT_MINOR) {
    throw new AppError('invalid_input', 'That total is larger than a payment can be', 400, { perSongFeeMinor: 'The total would be too large' });
  }
  return total;
}
