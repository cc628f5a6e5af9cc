// The search's time zone band compares standard-time offsets, so a drummer does not change band twice a
// year. Offsets come from the platform's IANA data (Intl), not from a table of our own.

/** The zone's UTC offset in minutes at `at`, e.g. +330 for Asia/Kolkata; throws RangeError on an unknown zone. */
export function utcOffsetMinutesAt(timeZone: string, at: Date): number {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(at)
    .find((p) => p.type === 'timeZoneName')?.value;
  // "GMT" alone means UTC; otherwise "GMT+05:30" / "GMT-03:00".
  const m = /^GMT(?:([+-])(\d{1,2})(?::(\d{2}))?)?$/.exec(name ?? '');
  if (!m) throw new RangeError(`cannot read the UTC offset of ${timeZone} (${name})`);
  if (!m[1]) return 0;
  const minutes = Number(m[2]) * 60 + Number(m[3] ?? 0);
  return m[1] === '-' ? -minutes : minutes;
}

/**
 * Standard (winter) offset: daylight saving moves clocks forward, so the smaller of the January and July
 * offsets is the standard one in both hemispheres.
 */
export function standardOffsetMinutes(timeZone: string, year = new Date().getUTCFullYear()): number {
  // Building an Intl formatter is the slow part; a bulk seed asks for the same few zones thousands of times.
  const key = `${timeZone}|${year}`;
  const known = cache.get(key);
  if (known !== undefined) return known;
  const january = utcOffsetMinutesAt(timeZone, new Date(Date.UTC(year, 0, 1, 12)));
  const july = utcOffsetMinutesAt(timeZone, new Date(Date.UTC(year, 6, 1, 12)));
  const standard = Math.min(january, july);
  cache.set(key, standard);
  return standard;
}

const cache = new Map<string, number>();
