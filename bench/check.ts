// npm run bench:check — the whole delivery check on 12 mono 24-bit 48 kHz stems of 4 minutes (≈415 MB)
// with the worker pool (2 threads), against ffmpeg's ebur128 (loudness + true peak only) over the same
// files with the same parallelism. Target: ours ≤ ½ of ffmpeg's time, under 250 MB resident.
//
// Our check runs in a child process so its peak resident memory (VmHWM, all threads) is its own and
// not the generator's.
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdir, readdir, readFile } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { checkDelivery } from '../server/audio/check-delivery';
import { createCheckPool } from '../server/audio/pool';
import { renderKit, writeWav } from '../server/audio/testing/synth-wav';

const HERE = dirname(fileURLToPath(import.meta.url));
const CACHE = join(HERE, '.cache', 'check-stems-v1');
const SECONDS = 240;
const RATE = 48_000;
const THREADS = 2;
const FFMPEG = '/usr/bin/ffmpeg';

export interface CheckBenchResult {
  ourSec: number;
  ffmpegSec: number;
  ratio: number;
  peakRssMb: number;
}

async function ensureStems(): Promise<string[]> {
  const done = join(CACHE, '.complete');
  if (!existsSync(done)) {
    await mkdir(CACHE, { recursive: true });
    process.stderr.write(`generating 12 stems of ${SECONDS} s in ${CACHE} (once)…\n`);
    const kit = renderKit({ sampleRate: RATE, seconds: SECONDS, tempo: 120, seed: 42 });
    for (const stem of kit) await writeWav(join(CACHE, stem.name), [stem.samples], { sampleRate: RATE, bits: 24 });
    await import('node:fs/promises').then((fs) => fs.writeFile(done, new Date().toISOString()));
  }
  return (await readdir(CACHE)).filter((f) => f.endsWith('.wav')).sort().map((f) => join(CACHE, f));
}

function peakRssFromProc(status: string): number {
  const match = /VmHWM:\s+(\d+) kB/.exec(status);
  return match ? Number(match[1]) / 1024 : NaN;
}

/** Child side: the timed check, then wall time and peak resident memory as JSON on stdout. */
async function runChild(files: string[]): Promise<void> {
  const started = performance.now();
  const pool = createCheckPool({ maxThreads: THREADS });
  try {
    const report = await checkDelivery(files.map((path) => ({ path, name: basename(path) })), { sampleRate: RATE, bitDepth: 24, tempo: 120, bars: SECONDS / 2 }, { pool });
    const sec = (performance.now() - started) / 1000;
    const peakRssMb = peakRssFromProc(await readFile('/proc/self/status', 'utf8'));
    process.stdout.write(`${JSON.stringify({ sec, peakRssMb, summary: report.summary, pairs: report.pairs.length })}\n`);
  } finally {
    await pool.destroy();
  }
}

function runProcess(command: string, args: string[]): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    child.on('error', reject);
    child.on('close', (code) => (code === 0 ? resolve(out) : reject(new Error(`${command} exited ${code}: ${err.slice(-2000)}`))));
  });
}

async function timeOurs(files: string[]): Promise<{ sec: number; peakRssMb: number; summary: string }> {
  const out = await runProcess(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--child', ...files]);
  return JSON.parse(out.trim().split('\n').at(-1) ?? '{}');
}

async function timeFfmpeg(files: string[]): Promise<number> {
  const started = performance.now();
  const queue = [...files];
  const lane = async () => {
    for (let file = queue.shift(); file; file = queue.shift()) {
      await runProcess(FFMPEG, ['-nostats', '-hide_banner', '-i', file, '-af', 'ebur128=peak=true', '-f', 'null', '-']);
    }
  };
  await Promise.all(Array.from({ length: THREADS }, lane));
  return (performance.now() - started) / 1000;
}

export async function runCheckBench(): Promise<CheckBenchResult> {
  const files = await ensureStems();
  // One untimed pass each so both start from a warm page cache.
  await timeFfmpeg(files.slice(0, 2));
  const ours = await timeOurs(files);
  const ffmpegSec = await timeFfmpeg(files);
  return { ourSec: ours.sec, ffmpegSec, ratio: ours.sec / ffmpegSec, peakRssMb: ours.peakRssMb };
}

async function main(): Promise<void> {
  if (process.argv.includes('--child')) {
    await runChild(process.argv.slice(process.argv.indexOf('--child') + 1));
    return;
  }
  const r = await runCheckBench();
  const rows = [
    ['delivery check (ours, 2 threads)', `${r.ourSec.toFixed(2)} s`],
    ['ffmpeg ebur128=peak=true (2 parallel)', `${r.ffmpegSec.toFixed(2)} s`],
    ['ratio ours / ffmpeg (target ≤ 0.50)', r.ratio.toFixed(2)],
    ['peak resident memory, ours (target < 250 MB)', `${r.peakRssMb.toFixed(0)} MB`],
  ];
  process.stdout.write(`12 stems × ${SECONDS} s, mono 24-bit ${RATE / 1000} kHz\n${rows.map(([k, v]) => `${k.padEnd(48)} ${v}`).join('\n')}\n`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  main().catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
    process.exitCode = 1;
  });
}
