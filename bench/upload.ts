// npm run bench:upload — one 2 GiB stem through the real tus endpoint (/api/uploads) of a real Kitlane server
// in its own process, while that process's resident memory is sampled; then the same bytes over a plain
// loopback HTTP copy (a bare server piping the request to a file) for comparison.
// Target (issue 5): the upload raises the server's RSS by less than 100 MB.
//
// The source file is generated once (pseudo-random bytes, so nothing along the way can compress it) into
// bench/.cache, with its SHA-256 beside it; the server's hash must match.
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream, existsSync } from 'node:fs';
import { mkdir, mkdtemp, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { fileURLToPath } from 'node:url';

const HERE = dirname(fileURLToPath(import.meta.url));
const CACHE = join(HERE, '.cache', 'upload-v1');
const SIZE = 2 * 1024 ** 3;

export interface UploadBenchResult {
  sizeBytes: number;
  tusSec: number;
  tusMBps: number;
  plainSec: number;
  plainMBps: number;
  baselineRssMb: number;
  peakRssMb: number;
  rssRiseMb: number;
  hashMatches: boolean;
}

async function ensureSource(): Promise<{ path: string; sha256: string }> {
  const path = join(CACHE, 'stem-2gib.bin');
  const shaFile = `${path}.sha256`;
  if (existsSync(shaFile) && (await stat(path).catch(() => null))?.size === SIZE) return { path, sha256: (await readFile(shaFile, 'utf8')).trim() };
  await mkdir(CACHE, { recursive: true });
  process.stderr.write(`generating a 2 GiB source file in ${CACHE} (once)…\n`);
  const hash = createHash('sha256');
  // xorshift32 noise: fast, deterministic and incompressible enough for this purpose.
  let x = 0x9e3779b9;
  async function* blocks() {
    for (let written = 0; written < SIZE; written += 4 * 1024 * 1024) {
      // A fresh buffer per block: the write stream may still hold the previous one.
      const block = Buffer.alloc(4 * 1024 * 1024);
      for (let i = 0; i < block.length; i += 4) {
        x ^= x << 13;
        x ^= x >>> 17;
        x ^= x << 5;
        block.writeUInt32LE(x >>> 0, i);
      }
      hash.update(block);
      yield block;
    }
  }
  await pipeline(Readable.from(blocks()), createWriteStream(path));
  const sha256 = hash.digest('hex');
  await writeFile(shaFile, sha256);
  return { path, sha256 };
}

function rssMbOf(status: string): number {
  const match = /VmRSS:\s+(\d+) kB/.exec(status);
  return match ? Number(match[1]) / 1024 : NaN;
}

async function sampleRss(pid: number): Promise<number> {
  return rssMbOf(await readFile(`/proc/${pid}/status`, 'utf8'));
}

/** Child side: a real server on a random port, a drummer with a funded booking and an announced file. */
async function runChild(size: number): Promise<void> {
  const { startTestApp } = await import('../tests/api/helpers/test-app');
  const { insertBooking, moveBooking, person } = await import('../tests/api/helpers/money');
  const app = await startTestApp();
  const songwriter = await person(app, `sw-${randomUUID()}@kitlane.test`, ['songwriter'], 'Bench Songwriter');
  const drummer = await person(app, `dr-${randomUUID()}@kitlane.test`, ['drummer'], 'Bench Drummer');
  const bookingId = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
  moveBooking(app.db, bookingId, ['funded']);
  const delivery = await drummer.client.post(`/api/bookings/${bookingId}/deliveries`, {});
  const file = await drummer.client.post(`/api/deliveries/${delivery.body.delivery.id}/files`, { name: 'Bench Stem.wav', sizeBytes: size });
  if (file.status !== 201) throw new Error(`announcing the file failed: ${JSON.stringify(file.body)}`);
  const cookie = (drummer.client as unknown as { cookie: string }).cookie;
  process.stdout.write(`${JSON.stringify({ url: app.url, cookie, deliveryId: delivery.body.delivery.id, fileId: file.body.file.id })}\n`);
  // Stays up until the parent ends it.
  process.on('SIGTERM', () => void app.close().then(() => process.exit(0)));
}

function startChild(): Promise<{ child: ChildProcess; info: { url: string; cookie: string; deliveryId: string; fileId: string } }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--child', String(SIZE)], { stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout!.on('data', (d) => {
      out += d;
      const line = out.split('\n').find((l) => l.startsWith('{'));
      if (line) resolve({ child, info: JSON.parse(line) });
    });
    child.on('error', reject);
    child.on('exit', (code) => reject(new Error(`the server process exited (${code}) before it was ready`)));
  });
}

async function tusUpload(info: { url: string; cookie: string; fileId: string }, source: string): Promise<void> {
  const b64 = (s: string) => Buffer.from(s).toString('base64');
  const created = await fetch(`${info.url}/api/uploads`, {
    method: 'POST',
    headers: { cookie: info.cookie, 'Tus-Resumable': '1.0.0', 'Upload-Length': String(SIZE), 'Upload-Metadata': `fileId ${b64(info.fileId)}` },
  });
  if (created.status !== 201) throw new Error(`tus create: ${created.status} ${await created.text()}`);
  const res = await fetch(info.url + created.headers.get('location'), {
    method: 'PATCH',
    headers: { cookie: info.cookie, 'Tus-Resumable': '1.0.0', 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream', 'Content-Length': String(SIZE) },
    body: Readable.toWeb(createReadStream(source, { highWaterMark: 1024 * 1024 })) as ReadableStream,
    duplex: 'half',
  } as RequestInit);
  if (res.status !== 204) throw new Error(`tus patch: ${res.status} ${await res.text()}`);
}

/** The baseline: a bare HTTP server writing the request body to a file, in its own process. */
async function plainCopy(source: string): Promise<number> {
  const dir = await mkdtemp(join(tmpdir(), 'kitlane-bench-plain-'));
  const target = join(dir, 'copy.bin');
  const server = createServer((req, res) => {
    void pipeline(req, createWriteStream(target)).then(() => res.end('ok'));
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const { port } = server.address() as { port: number };
  const started = performance.now();
  const res = await fetch(`http://127.0.0.1:${port}/`, {
    method: 'PUT',
    headers: { 'Content-Length': String(SIZE) },
    body: Readable.toWeb(createReadStream(source, { highWaterMark: 1024 * 1024 })) as ReadableStream,
    duplex: 'half',
  } as RequestInit);
  await res.text();
  const sec = (performance.now() - started) / 1000;
  server.close();
  await rm(dir, { recursive: true, force: true });
  return sec;
}

export async function runUploadBench(): Promise<UploadBenchResult> {
  const source = await ensureSource();
  const { child, info } = await startChild();
  try {
    const pid = child.pid!;
    await new Promise((r) => setTimeout(r, 1000));
    const baselineRssMb = await sampleRss(pid);
    let peakRssMb = baselineRssMb;
    const sampler = setInterval(() => {
      void sampleRss(pid).then((mb) => (peakRssMb = Math.max(peakRssMb, mb)), () => undefined);
    }, 100);
    const started = performance.now();
    await tusUpload(info, source.path);
    const tusSec = (performance.now() - started) / 1000;
    clearInterval(sampler);
    peakRssMb = Math.max(peakRssMb, await sampleRss(pid));
    const view = await fetch(`${info.url}/api/deliveries/${info.deliveryId}`, { headers: { cookie: info.cookie } }).then((r) => r.json() as Promise<{ delivery: { files: { sha256: string | null }[] } }>);
    const hashMatches = view.delivery.files[0]?.sha256 === source.sha256;
    const plainSec = await plainCopy(source.path);
    const mb = SIZE / 1024 ** 2;
    return {
      sizeBytes: SIZE,
      tusSec,
      tusMBps: mb / tusSec,
      plainSec,
      plainMBps: mb / plainSec,
      baselineRssMb,
      peakRssMb,
      rssRiseMb: peakRssMb - baselineRssMb,
      hashMatches,
    };
  } finally {
    child.kill('SIGTERM');
  }
}

const isMain = process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1];
if (isMain && process.argv[2] === '--child') {
  await runChild(Number(process.argv[3]));
} else if (isMain) {
  const r = await runUploadBench();
  const f = (n: number, d = 1) => n.toFixed(d);
  process.stdout.write(
    [
      `upload of ${f(r.sizeBytes / 1024 ** 3, 0)} GiB through tus: ${f(r.tusSec, 2)} s (${f(r.tusMBps, 0)} MB/s), SHA-256 ${r.hashMatches ? 'matches' : 'DOES NOT MATCH'}`,
      `plain loopback copy of the same bytes: ${f(r.plainSec, 2)} s (${f(r.plainMBps, 0)} MB/s)`,
      `server RSS: ${f(r.baselineRssMb, 0)} MB before, ${f(r.peakRssMb, 0)} MB peak, rise ${f(r.rssRiseMb, 0)} MB (target < 100 MB) — ${r.rssRiseMb < 100 && r.hashMatches ? 'PASS' : 'FAIL'}`,
    ].join('\n') + '\n',
  );
  process.exit(0);
}
