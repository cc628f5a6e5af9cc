// npm run bench [-- --quick]: every benchmark the issues asked for, one table (figure, target, pass/fail).
// Each benchmark runs on its own; one that throws shows its error in its row and the others still run.
// --quick: the load test for 5 s and fewer search queries; the delivery check (≈415 MB of stems), the 2 GiB
// upload and Lighthouse (Chromium) are left out. Exit code 1 when a measured row misses its target.
import { resolve } from 'node:path';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname } from 'node:path';
import { runBundleBench, INITIAL_JS_TARGET_KB, buildClient } from './bundle';
import { runLoadBench, loadPassed } from './load';

type Status = 'pass' | 'FAIL' | 'n/a' | 'skipped' | 'error';
export type BenchRow = { bench: string; figure: string; target: string; status: Status };

const HERE = dirname(fileURLToPath(import.meta.url));
const quick = process.argv.includes('--quick');
const largeDir = resolve(process.env.BENCH_LARGE_DIR ?? join(tmpdir(), 'kitlane-bench-large'));
const verdict = (ok: boolean): Status => (ok ? 'pass' : 'FAIL');
const messageOf = (e: unknown) => (e instanceof Error ? e.message : String(e)).split('\n')[0].slice(0, 120);

/** Runs one benchmark; a thrown error becomes an "error" row so the report is always complete. */
async function section(name: string, run: () => Promise<BenchRow[]>): Promise<BenchRow[]> {
  process.stderr.write(`[bench] ${name}…\n`);
  const started = performance.now();
  try {
    const rows = await run();
    process.stderr.write(`[bench] ${name} done in ${((performance.now() - started) / 1000).toFixed(1)} s\n`);
    return rows;
  } catch (e) {
    return [{ bench: name, figure: `error: ${messageOf(e)}`, target: '', status: 'error' }];
  }
}

/** A benchmark another engineer owns may not have landed yet: import it if present, else say why not. */
async function optionalModule<T>(file: string): Promise<{ mod: T | null; reason: string }> {
  if (!existsSync(join(HERE, `${file}.ts`))) return { mod: null, reason: `not available: bench/${file}.ts does not exist yet` };
  try {
    return { mod: (await import(`./${file}`)) as T, reason: '' };
  } catch (e) {
    return { mod: null, reason: `not available: bench/${file}.ts failed to load (${messageOf(e)})` };
  }
}

async function checkRows(): Promise<BenchRow[]> {
  if (quick) return [{ bench: 'delivery check vs ffmpeg', figure: 'skipped (--quick)', target: 'ratio ≤ 0.50, < 250 MB', status: 'skipped' }];
  const { runCheckBench } = await import('./check');
  const r = await runCheckBench();
  return [
    { bench: 'delivery check vs ffmpeg (12 × 4 min, 2 threads)', figure: `${r.ourSec.toFixed(2)} s vs ${r.ffmpegSec.toFixed(2)} s = ${r.ratio.toFixed(2)}`, target: 'ratio ≤ 0.50', status: verdict(r.ratio <= 0.5) },
    { bench: 'delivery check peak memory', figure: `${r.peakRssMb.toFixed(0)} MB`, target: '< 250 MB', status: verdict(r.peakRssMb < 250) },
  ];
}

type SearchModule = { runSearchBench(opts: { dataDir?: string; queries?: number }): Promise<{ p95Ms: number; p50Ms: number; rawP95Ms: number; targetP95Ms: number; profiles: number }> };

async function searchRows(): Promise<BenchRow[]> {
  const { mod, reason } = await optionalModule<SearchModule>('search');
  if (!mod?.runSearchBench) return [{ bench: 'search p95 vs raw SQLite', figure: reason || 'not available: no runSearchBench export', target: '', status: 'n/a' }];
  const r = await mod.runSearchBench({ dataDir: largeDir, queries: quick ? 100 : 500 });
  return [
    {
      bench: `drummer search p95 (${r.profiles} profiles)`,
      figure: `API ${r.p95Ms} ms (p50 ${r.p50Ms}) vs raw SQL ${r.rawP95Ms} ms`,
      target: `p95 < ${r.targetP95Ms} ms`,
      status: verdict(r.p95Ms < r.targetP95Ms),
    },
  ];
}

type UploadResult = { sizeBytes: number; tusSec: number; tusMBps: number; plainSec: number; plainMBps: number; peakRssMb: number; rssRiseMb: number; hashMatches: boolean };
type UploadModule = { runUploadBench(): Promise<UploadResult> };
// Issue 5's target for the upload: the server's resident memory rises by less than 100 MB during a 2 GiB upload.
const UPLOAD_RSS_RISE_TARGET_MB = 100;

async function uploadRows(): Promise<BenchRow[]> {
  if (quick) return [{ bench: 'upload via tus vs loopback copy', figure: 'skipped (--quick)', target: `hash matches, RSS rise < ${UPLOAD_RSS_RISE_TARGET_MB} MB`, status: 'skipped' }];
  const { mod, reason } = await optionalModule<UploadModule>('upload');
  if (!mod?.runUploadBench) return [{ bench: 'upload throughput + memory vs loopback copy', figure: reason || 'not available: no runUploadBench export', target: '', status: 'n/a' }];
  const r = await mod.runUploadBench();
  const gib = (r.sizeBytes / 1024 ** 3).toFixed(0);
  return [
    {
      bench: `upload ${gib} GiB via tus vs plain loopback copy`,
      figure: `${r.tusMBps.toFixed(0)} MB/s (${r.tusSec.toFixed(1)} s) vs ${r.plainMBps.toFixed(0)} MB/s (${r.plainSec.toFixed(1)} s), SHA-256 ${r.hashMatches ? 'matches' : 'DIFFERS'}`,
      target: 'hash matches',
      status: verdict(r.hashMatches),
    },
    { bench: 'upload server memory rise', figure: `+${r.rssRiseMb.toFixed(0)} MB (peak ${r.peakRssMb.toFixed(0)} MB)`, target: `< ${UPLOAD_RSS_RISE_TARGET_MB} MB`, status: verdict(r.rssRiseMb < UPLOAD_RSS_RISE_TARGET_MB) },
  ];
}

async function loadRows(): Promise<BenchRow[]> {
  const r = await runLoadBench({ quick, dataDir: largeDir });
  return [
    {
      bench: `load: mixed traffic, ${r.connections} conns × ${r.durationSec} s`,
      figure: `${r.requestsPerSec} req/s, p50 ${r.p50Ms} / p95 ${r.p95Ms} / p99 ${r.p99Ms} ms, ${r.requests} requests`,
      target: 'zero errors',
      status: verdict(loadPassed(r)),
    },
    {
      bench: 'load: errors (incl. timeouts) / timeouts / other non-2xx / 429',
      // The status breakdown names what the non-2xx answers were (e.g. 401 vs 503), so a failed run says why.
      figure: `${r.errors} / ${r.timeouts} / ${r.otherNon2xx} / ${r.rateLimited}; statuses ${Object.entries(r.statusCounts).map(([c, n]) => `${c}×${n}`).join(' ')}`,
      target: '0 / 0 / 0 (429 counted apart)',
      status: verdict(loadPassed(r)),
    },
    ...Object.entries(r.nonOk).map(([key, v]) => ({ bench: `load: non-2xx ${key}`, figure: `${v.count}× e.g. ${v.sample.slice(0, 80)}`, target: 'none', status: 'FAIL' as Status })),
  ];
}

let builtDist: string | null = null;

async function reviewRoomRows(): Promise<BenchRow[]> {
  if (quick) return [{ bench: 'review room open → playing (12 × 4 min)', figure: 'skipped (--quick)', target: '≤ 2 s, ≤ 600 MB', status: 'skipped' }];
  const { runReviewRoomBench } = await import('./review-room');
  const r = await runReviewRoomBench();
  return [
    { bench: `review room open → playing (${r.stems} stems)`, figure: `${r.openToPlaySec.toFixed(2)} s`, target: '≤ 2 s', status: verdict(r.openToPlaySec <= 2) },
    { bench: 'review room renderer memory', figure: `${Math.round(r.rendererRssMb)} MB`, target: '≤ 600 MB', status: verdict(r.rendererRssMb <= 600) },
  ];
}

async function bundleRows(): Promise<BenchRow[]> {
  builtDist = await buildClient();
  const r = await runBundleBench({ outDir: builtDist });
  return [
    { bench: `initial JS (gzip, ${r.jsFiles.length} files)`, figure: `${r.jsGzipKb} kB`, target: `≤ ${INITIAL_JS_TARGET_KB} kB`, status: verdict(r.jsGzipKb <= INITIAL_JS_TARGET_KB) },
    { bench: 'initial CSS (gzip)', figure: `${r.cssGzipKb} kB`, target: '(reported)', status: 'n/a' },
  ];
}

async function lighthouseRows(): Promise<BenchRow[]> {
  if (quick) return [{ bench: 'Lighthouse home/search/review', figure: 'skipped (--quick)', target: 'perf ≥ 0.9, a11y 1.0', status: 'skipped' }];
  const { runLighthouseBench, LIGHTHOUSE_TARGETS } = await import('./lighthouse');
  const r = await runLighthouseBench({ distDir: builtDist ?? undefined });
  return r.pages.flatMap((p) => [
    { bench: `Lighthouse performance: ${p.name} (${r.preset}, median of ${p.runs.length})`, figure: `${p.performance} (runs ${p.runs.join(' / ')})`, target: `≥ ${LIGHTHOUSE_TARGETS.performance}`, status: verdict((p.performance ?? 0) >= LIGHTHOUSE_TARGETS.performance) },
    {
      bench: `Lighthouse accessibility: ${p.name}`,
      figure: `${p.accessibility}${p.failedA11y.length ? ` (failing: ${p.failedA11y.join(', ')})` : ''}`,
      target: `${LIGHTHOUSE_TARGETS.accessibility.toFixed(1)}`,
      status: verdict((p.accessibility ?? 0) >= LIGHTHOUSE_TARGETS.accessibility),
    },
  ]);
}

export function formatTable(rows: BenchRow[]): string {
  const head: BenchRow = { bench: 'benchmark', figure: 'figure', target: 'target', status: 'pass' };
  const w = (k: keyof BenchRow) => Math.max(...[head, ...rows].map((r) => r[k].length));
  const line = (r: BenchRow, status: string) => `${r.bench.padEnd(w('bench'))} | ${r.figure.padEnd(w('figure'))} | ${r.target.padEnd(w('target'))} | ${status}`;
  const rule = '-'.repeat(w('bench') + w('figure') + w('target') + 16);
  return [line(head, 'result'), rule, ...rows.map((r) => line(r, r.status))].join('\n');
}

async function main(): Promise<void> {
  const started = new Date();
  const rows: BenchRow[] = [];
  // Order: the CPU-heavy delivery check first and Lighthouse last, so neither disturbs the timed HTTP runs.
  rows.push(...(await section('delivery check', checkRows)));
  rows.push(...(await section('upload', uploadRows)));
  rows.push(...(await section('search', searchRows)));
  rows.push(...(await section('load', loadRows)));
  rows.push(...(await section('review room', reviewRoomRows)));
  rows.push(...(await section('bundle', bundleRows)));
  rows.push(...(await section('lighthouse', lighthouseRows)));
  process.stdout.write(`\nKitlane benchmarks — ${started.toISOString()}${quick ? ' (--quick)' : ''}\n${formatTable(rows)}\n`);
  if (rows.some((r) => r.status === 'FAIL' || r.status === 'error')) process.exitCode = 1;
}

main().catch((e: unknown) => {
  process.stderr.write(`${e instanceof Error ? e.stack : String(e)}\n`);
  process.exitCode = 1;
});
