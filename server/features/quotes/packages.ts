import type { Db } from '../../db/client';

export type ResolvedPackage = {
  id: string;
  engineerId: string;
  name: string;
  /** The package price is the engineer's share of the quote. */
  priceMinor: number;
  currency: string;
  /** Copied into the booking when the quote is accepted. */
  inputList: unknown;
};

/**
 * The one seam between quotes and mic packages. The rooms issue owns the package tables and fills this in;
 * until a package table exists no package id can be resolved, and a quote that names one is refused with
 * a field error (drummers name an engineer and their share instead).
 */
export function resolvePackage(_db: Db, _packageId: string): ResolvedPackage | null {
  return null;
}
