/**
 * Every IANA time zone the browser knows, plus the account's current one (the server's default "UTC" is
 * not in every engine's list), sorted for the select.
 */
export function timeZoneOptions(current: string): Array<{ value: string; label: string }> {
  const known = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
  const all = new Set<string>([...known, 'UTC', current]);
  return [...all].sort((a, b) => a.localeCompare(b)).map((zone) => ({ value: zone, label: zone.replace(/_/g, ' ') }));
}
