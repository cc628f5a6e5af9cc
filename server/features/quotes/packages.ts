import type { Db } from '../../db/client';
import { createMicPackagesService, toBookingInputList } from '../mic-packages/mic-packages.service';
import type { BookingInputList } from '@shared/schemas/mic-packages';

export type ResolvedPackage = {
  id: string;
  engineerId: string;
  name: string;
  /** The package price is the engineer's share of the quote. */
  priceMinor: number;
  currency: string;
  /** Copied into the booking when the quote is accepted (channels, pairs and the delivery check's pairs). */
  inputList: BookingInputList;
};

/**
 * The one seam between quotes and mic packages (the rooms feature owns the package tables). A package that
 * was removed, or whose engineer is disabled, resolves to null and the quote is refused with a field error.
 * Removing a package is refused while a waiting quote names it, so acceptance always finds it.
 */
export function resolvePackage(db: Db, packageId: string): ResolvedPackage | null {
  const row = createMicPackagesService({ db }).resolve(packageId);
  if (!row) return null;
  return { id: row.id, engineerId: row.engineerId, name: row.name, priceMinor: row.priceMinor, currency: row.currency, inputList: toBookingInputList(row) };
}
