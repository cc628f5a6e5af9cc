// Byte ranges for streaming reel audio (RFC 9110 §14): media elements seek by asking for ranges.

export type RangeAnswer =
  | { kind: 'full' }
  | { kind: 'partial'; start: number; end: number }
  | { kind: 'unsatisfiable' };

/**
 * Reads a `Range` header against a file of `size` bytes. Other units and multi-range requests are
 * ignored (a 200 with the whole file is allowed by the RFC, and media elements send one range); a bytes
 * range that is malformed, reversed or starts past the end is unsatisfiable (416).
 */
export function parseRange(header: string | undefined, size: number): RangeAnswer {
  if (header === undefined) return { kind: 'full' };
  const match = /^\s*bytes\s*=\s*(.*)$/i.exec(header);
  if (!match) return { kind: 'full' };
  const specs = match[1].split(',');
  if (specs.length > 1) return { kind: 'full' };
  const spec = /^\s*(\d*)\s*-\s*(\d*)\s*$/.exec(specs[0]);
  if (!spec || (spec[1] === '' && spec[2] === '') || size === 0) return { kind: 'unsatisfiable' };
  if (spec[1] === '') {
    const suffix = Number(spec[2]);
    if (suffix === 0) return { kind: 'unsatisfiable' };
    return { kind: 'partial', start: Math.max(0, size - suffix), end: size - 1 };
  }
  const start = Number(spec[1]);
  const last = spec[2] === '' ? null : Number(spec[2]);
  if (start >= size || (last !== null && last < start)) return { kind: 'unsatisfiable' };
  return { kind: 'partial', start, end: last === null ? size - 1 : Math.min(last, size - 1) };
}
