// The delivery check as a command for engineers, to run on their own files before uploading:
//   npm run check-stems -- [--json] [--rate 48000] [--depth 24|32f] [--tempo BPM --bars N --beats-per-bar N] FILE...
// Exit code 0 when nothing fails, 1 when a check fails, 2 when a file cannot be read.
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import type { DeliveryCheckReport } from '@shared/schemas/delivery-check';
import { checkDelivery, type DeliveryExpect } from '../server/audio/check-delivery';
import { createCheckPool, type CheckPool } from '../server/audio/pool';

const USAGE = 'usage: npm run check-stems -- [--json] [--rate 48000] [--depth 24|32f] [--tempo BPM --bars N --beats-per-bar N] FILE...';

class UsageError extends Error {}

function positiveNumber(value: string | undefined, flag: string): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  if (!Number.isFinite(n) || n <= 0) throw new UsageError(`${flag} needs a positive number, got "${value}"`);
  return n;
}

export function parseCommandLine(argv: string[]): { json: boolean; expect: DeliveryExpect; files: string[] } {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      json: { type: 'boolean', default: false },
      rate: { type: 'string' },
      depth: { type: 'string' },
      tempo: { type: 'string' },
      bars: { type: 'string' },
      'beats-per-bar': { type: 'string' },
      help: { type: 'boolean', short: 'h', default: false },
    },
  });
  if (values.help) throw new UsageError('');
  if (positionals.length === 0) throw new UsageError('no files given');
  const depth = values.depth === undefined ? undefined : values.depth.toLowerCase() === '32f' ? ('32f' as const) : positiveNumber(values.depth, '--depth');
  return {
    json: values.json ?? false,
    files: positionals,
    expect: {
      sampleRate: positiveNumber(values.rate, '--rate'),
      bitDepth: depth,
      tempo: positiveNumber(values.tempo, '--tempo'),
      bars: positiveNumber(values.bars, '--bars'),
      beatsPerBar: positiveNumber(values['beats-per-bar'], '--beats-per-bar'),
    },
  };
}

/** Exactly the documented JSON shape (issue 5): nothing more per stem or pair. */
export function toCliJson(report: DeliveryCheckReport): unknown {
  return {
    stems: report.stems.map((s) => ({
      file: s.file,
      format: s.format,
      sampleRate: s.sampleRate,
      bitDepth: s.bitDepth,
      channels: s.channels,
      frames: s.frames,
      durationSec: s.durationSec,
      samplePeakDbfs: s.samplePeakDbfs,
      truePeakDbtp: s.truePeakDbtp,
      integratedLufs: s.integratedLufs,
      rmsDbfs: s.rmsDbfs,
      dcOffset: s.dcOffset,
      clippedRuns: s.clippedRuns,
      silent: s.silent,
      rumbleDb: s.rumbleDb,
      timeReference: s.timeReference,
    })),
    pairs: report.pairs.map((p) => ({ a: p.a, b: p.b, lagSamples: p.lagSamples, lagMs: p.lagMs, distanceCm: p.distanceCm, correlation: p.correlation, polarity: p.polarity })),
    checks: report.checks.map((c) => ({ id: c.id, level: c.level, message: c.message, ...(c.detail ? { detail: c.detail } : {}), files: c.files })),
  };
}

export function exitCodeFor(report: DeliveryCheckReport): number {
  if (report.unreadable.length > 0) return 2;
  return report.level === 'fail' ? 1 : 0;
}

function cell(value: number | string | boolean | null, digits = 1): string {
  if (value === null) return '–';
  if (typeof value === 'number') return Number.isInteger(value) && digits === 0 ? String(value) : value.toFixed(digits);
  return String(value);
}

function table(rows: string[][]): string {
  const widths = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  return rows.map((r) => r.map((c, i) => c.padEnd(widths[i])).join('  ').trimEnd()).join('\n');
}

export function formatReport(report: DeliveryCheckReport): string {
  const out: string[] = [report.summary, ''];
  if (report.stems.length > 0) {
    const head = ['file', 'format', 'rate', 'bits', 'ch', 'length s', 'peak dBFS', 'TP dBTP', 'LUFS', 'RMS dBFS', 'DC', 'clips', 'rumble dB', 'time ref'];
    const rows = report.stems.map((s) => [
      s.name, s.format, String(s.sampleRate), String(s.bitDepth), String(s.channels), s.durationSec.toFixed(3),
      cell(s.samplePeakDbfs), cell(s.truePeakDbtp), cell(s.integratedLufs), cell(s.rmsDbfs), s.dcOffset.toFixed(4),
      String(s.clippedRuns), cell(s.rumbleDb), s.timeReference === null ? '–' : String(s.timeReference),
    ]);
    out.push(table([head, ...rows]), '');
  }
  if (report.pairs.length > 0) {
    const head = ['a', 'b', 'lag smp', 'lag ms', 'cm', 'corr', 'polarity'];
    const rows = report.pairs.map((p) => [p.a, p.b, String(p.lagSamples), p.lagMs.toFixed(3), p.distanceCm.toFixed(1), p.correlation.toFixed(3), p.polarity]);
    out.push(table([head, ...rows]), '');
  }
  for (const c of report.checks) {
    out.push(`[${c.level.toUpperCase()}] ${c.message}`);
    if (c.detail && c.level !== 'pass') out.push(`       ${c.detail}`);
  }
  return out.join('\n');
}

function progressPrinter(): ((fraction: number, label: string) => void) | undefined {
  if (!process.stderr.isTTY) return undefined;
  return (fraction, label) => {
    process.stderr.write(`\r\x1b[K${Math.round(fraction * 100)}% ${label}`);
    if (fraction >= 1) process.stderr.write('\r\x1b[K');
  };
}

export async function main(argv: string[]): Promise<number> {
  let args: ReturnType<typeof parseCommandLine>;
  try {
    args = parseCommandLine(argv);
  } catch (error) {
    if (!(error instanceof UsageError) && !(error instanceof TypeError)) throw error;
    if (error.message) process.stderr.write(`${error.message}\n`);
    process.stderr.write(`${USAGE}\n`);
    return 2;
  }
  // Workers pay off from two files on; one file is measured in this thread.
  const pool: CheckPool | undefined = args.files.length > 1 ? createCheckPool({ maxThreads: Math.min(args.files.length, 4) }) : undefined;
  try {
    const files = args.files.map((path) => ({ path, name: path }));
    const report = await checkDelivery(files, args.expect, { pool, onProgress: progressPrinter() });
    process.stdout.write(args.json ? `${JSON.stringify(toCliJson(report), null, 2)}\n` : `${formatReport(report)}\n`);
    return exitCodeFor(report);
  } finally {
    await pool?.destroy();
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === resolve(process.argv[1])) {
  main(process.argv.slice(2)).then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => {
      process.stderr.write(`check-stems: ${error instanceof Error ? error.stack : String(error)}\n`);
      process.exitCode = 2;
    },
  );
}
