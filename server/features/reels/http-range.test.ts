import { describe, expect, it } from 'vitest';
import { parseRange } from './http-range';

// Cases follow RFC 9110 §14.1.2 (byte ranges) and its examples for a 10000-byte representation.
describe('parsing a Range header (RFC 9110 §14.1.2)', () => {
  const size = 10_000;

  it('serves the whole file when there is no Range header or another unit', () => {
    expect(parseRange(undefined, size)).toEqual({ kind: 'full' });
    expect(parseRange('items=0-5', size)).toEqual({ kind: 'full' });
  });

  it('reads first-last, open-ended and suffix ranges as in the RFC examples', () => {
    expect(parseRange('bytes=0-499', size)).toEqual({ kind: 'partial', start: 0, end: 499 });
    expect(parseRange('bytes=500-999', size)).toEqual({ kind: 'partial', start: 500, end: 999 });
    expect(parseRange('bytes=9500-', size)).toEqual({ kind: 'partial', start: 9500, end: 9999 });
    expect(parseRange('bytes=-500', size)).toEqual({ kind: 'partial', start: 9500, end: 9999 });
  });

  it('clamps a last byte beyond the end and a suffix longer than the file', () => {
    expect(parseRange('bytes=9000-20000', size)).toEqual({ kind: 'partial', start: 9000, end: 9999 });
    expect(parseRange('bytes=-20000', size)).toEqual({ kind: 'partial', start: 0, end: 9999 });
  });

  it('calls ranges past the end, reversed or malformed unsatisfiable', () => {
    expect(parseRange('bytes=10000-', size)).toEqual({ kind: 'unsatisfiable' });
    expect(parseRange('bytes=500-100', size)).toEqual({ kind: 'unsatisfiable' });
    expect(parseRange('bytes=abc', size)).toEqual({ kind: 'unsatisfiable' });
    expect(parseRange('bytes=-', size)).toEqual({ kind: 'unsatisfiable' });
    expect(parseRange('bytes=-0', size)).toEqual({ kind: 'unsatisfiable' });
    expect(parseRange('bytes=0-0', 0)).toEqual({ kind: 'unsatisfiable' });
  });

  it('answers a multi-range request with the whole file', () => {
    expect(parseRange('bytes=0-10, 20-30', size)).toEqual({ kind: 'full' });
  });
});
