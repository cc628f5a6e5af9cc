// npm run bench:review — the real review room with a 12-stem, 4-minute delivery (the stems bench/check.ts
// caches in bench/.cache): a real Kitlane server (built client, demo seed), the delivery made through the
// delivery service and its own job handlers, then Debian's Chromium opens /deliveries/:id as the songwriter,
// presses Play as soon as it is enabled, and we read the page's own marks (review-open, review-playable,
// review-playing, review-whole) and the browser's memory once the whole stems are decoded.
// Targets (issue 5): navigation → playing ≤ 2 s; browser memory ≤ ~600 MB.
import { createHash } from 'node:crypto';
import { createReadStream, existsSync } from 'node:fs';
import { copyFile, mkdir, mkdtemp, readdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { eq } from 'drizzle-orm';
import { chromium, type Browser } from 'playwright-core';
import { boot, type Running } from '../server/boot';
import { parseEnv } from '../server/env';
import { bookings, briefs, users } from '../server/db/schema';
import type { CurrentUser } from '../server/auth/middleware';
import { renderKit, writeWav } from '../server/audio/testing/synth-wav';
import { readDeliverySettings } from '../server/features/deliveries/deliveries.config';
import { createDeliveriesService } from '../server/features/deliveries/deliveries.service';
import { deliveriesRepo } from '../server/features/deliveries/deliveries.repository';
import { deliveryWork } from '../server/features/deliveries/delivery-jobs';
import { moneySeam } from '../server/features/deliveries/money-seam';
import { buildClientOnce } from '../tests/e2e/helpers/server';

const HERE = dirname(fileURLToPath(import.meta.url));
// The same folder, stems and marker as bench/check.ts, so whichever bench runs first generates them.
const CACHE = join(HERE, '.cache', 'check-stems-v1');
const SECONDS = 240;
const RATE = 48_000;
const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'kitlane-demo-pass';
const CHROMIUM_ARGS = ['--autoplay-policy=no-user-gesture-required', '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
// The demo booking bench uses: funded, teo (songwriter) hired juno (drummer), no delivery yet.
const SONG = 'Quiet Harbour';

export interface ReviewRoomBenchResult {
  stems: number;
  stemSeconds: number;
  /** Navigation start → the transport is playing (the page's review-playing mark). */
  openToPlaySec: number;
  /** Navigation start → the review room mounted and started loading the previews (page, auth and delivery loaded). */
  openToEngineSec: number;
  /** Navigation start → the last preview fully received. */
  previewsInSec: number;
  /** Navigation start → every stem's first part decoded and Play enabled. */
  openToPlayableSec: number;
  /** Navigation start → the whole stems decoded and swapped in. */
  openToWholeSec: number;
  /** V8 heap in use in the page (CDP Performance.getMetrics JSHeapUsedSize), after the whole decode. */
  jsHeapMb: number;
  /** Resident memory of the page's renderer process (decoded audio lives here, outside the JS heap). */
  rendererRssMb: number;
  /** Resident memory of every Chromium process of this browser (browser, GPU/utility, renderers). */
  browserRssMb: number;
  /** Bytes of previews the page fetched. */
  previewMb: number;
}

async function ensureStems(): Promise<string[]> {
  if (!existsSync(join(CACHE, '.complete'))) {
    await mkdir(CACHE, { recursive: true });
    process.stderr.write(`generating 12 stems of ${SECONDS} s in ${CACHE} (once)…\n`);
    const kit = renderKit({ sampleRate: RATE, seconds: SECONDS, tempo: 120, seed: 42 });
    for (const stem of kit) await writeWav(join(CACHE, stem.name), [stem.samples], { sampleRate: RATE, bits: 24 });
    await writeFile(join(CACHE, '.complete'), new Date().toISOString());
  }
  return (await readdir(CACHE)).filter((f) => f.endsWith('.wav')).sort().map((f) => join(CACHE, f));
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

async function startServer(dataDir: string): Promise<Running> {
  await buildClientOnce();
  const [port, smtpPort, webPort, paymentsPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const env = parseEnv({
    ...process.env,
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    PORT: String(port),
    APP_URL: `http://127.0.0.1:${port}`,
    MAIL_SMTP_PORT: String(smtpPort),
    MAIL_WEB_PORT: String(webPort),
    PAYMENTS_PORT: String(paymentsPort),
    DATA_DIR: dataDir,
    LOG_LEVEL: 'silent',
    SEED_DEMO: 'true',
    START_FAKES: 'true',
    SMTP_URL: '',
  });
  return boot({ env, randomPorts: false, quiet: true });
}

function demoUser(running: Running, email: string): CurrentUser {
  const row = running.db.select().from(users).where(eq(users.email, email)).get();
  if (!row) throw new Error(`demo user ${email} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: true, timeZone: row.timeZone };
}

async function sha256Of(path: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(path, { highWaterMark: 1024 * 1024 })) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

/** A submitted 12-stem delivery on the demo booking, made by the service and its job handlers (2 lanes). */
async function prepareDelivery(running: Running, stems: string[], scratch: string): Promise<{ deliveryId: string; songwriter: string }> {
  const ctx = running.kitlane.ctx;
  const row = running.db.select({ id: bookings.id }).from(bookings).innerJoin(briefs, eq(briefs.id, bookings.briefId)).where(eq(briefs.songTitle, SONG)).get();
  if (!row) throw new Error(`the demo booking "${SONG}" is missing`);
  const settings = readDeliverySettings();
  const service = createDeliveriesService(ctx, { settings, money: moneySeam(ctx) });
  const work = deliveryWork(ctx, service, settings);
  const drummer = demoUser(running, 'juno@kitlane.test');
  // The runner would run the same handlers one at a time; here they run two at a time, then it resumes.
  await ctx.jobs.stop();
  const delivery = service.create(drummer, row.id, { note: 'Bench: 12 stems of 4 minutes.' });
  for (const path of stems) {
    const copy = join(scratch, basename(path));
    await copyFile(path, copy);
    const file = service.addFile(drummer, delivery.id, { name: basename(path), sizeBytes: (await stat(copy)).size, part: null });
    await service.completeUpload(file.id, copy, await sha256Of(copy));
  }
  const queue = service.viewOf(drummer, delivery.id).files.map((f) => f.id);
  const lane = async () => {
    for (let id = queue.shift(); id; id = queue.shift()) await work.preview({ fileId: id }, { attempt: 1 });
  };
  await Promise.all([lane(), lane()]);
  await work.check({ deliveryId: delivery.id, run: deliveriesRepo.delivery(running.db, delivery.id)?.checkRun ?? 0 }, { attempt: 1 });
  service.submit(drummer, delivery.id);
  ctx.jobs.start();
  return { deliveryId: delivery.id, songwriter: 'teo@kitlane.test' };
}

async function rssMb(pid: number): Promise<number> {
  const status = await readFile(`/proc/${pid}/status`, 'utf8').catch(() => '');
  const match = /VmRSS:\s+(\d+) kB/.exec(status);
  return match ? Number(match[1]) / 1024 : 0;
}

async function measureInBrowser(browser: Browser, url: string, deliveryId: string, email: string): Promise<Omit<ReviewRoomBenchResult, 'stems' | 'stemSeconds'>> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  // Play is pressed inside the page the moment it turns enabled. Seen from outside (waitForFunction, then a click
  // over the protocol) the same moment came 0.6 s late on two busy cores: the harness, not the room. A click from
  // script carries no user activation, so Chromium runs with --autoplay-policy=no-user-gesture-required.
  await page.addInitScript(() => {
    const pressWhenEnabled = new MutationObserver(() => {
      const play = document.querySelector<HTMLButtonElement>('[data-testid="transport-play"]');
      if (!play || play.disabled) return;
      pressWhenEnabled.disconnect();
      play.click();
    });
    document.addEventListener('DOMContentLoaded', () => pressWhenEnabled.observe(document.body, { subtree: true, childList: true, attributes: true }));
  });
  await page.goto(`${url}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));

  // A full navigation, so the marks count from this document's start as a person opening the link.
  await page.goto(`${url}/deliveries/${deliveryId}`, { waitUntil: 'commit' });
  await page.waitForFunction(() => performance.getEntriesByName('review-playing').length > 0, undefined, { timeout: 60_000 });
  await page.waitForFunction(() => performance.getEntriesByName('review-whole').length > 0, undefined, { timeout: 180_000 });
  const marks = await page.evaluate(() => Object.fromEntries(['review-open', 'review-playable', 'review-playing', 'review-whole'].map((n) => [n, performance.getEntriesByName(n)[0]?.startTime ?? NaN])));
  // Bytes from the page's own resource timing: reading bodies over the protocol while the page loads queued the
  // click behind them (about a second on a 2-core machine) and measured the harness instead of the room.
  const previewBytes = await page.evaluate(() =>
    performance.getEntriesByType('resource').filter((e) => new URL(e.name).pathname.endsWith('/preview')).reduce((sum, e) => sum + (e as PerformanceResourceTiming).encodedBodySize, 0),
  );
  const previewsInSec = await page.evaluate(
    () => Math.max(0, ...performance.getEntriesByType('resource').filter((e) => e.name.endsWith('/preview')).map((e) => (e as PerformanceResourceTiming).responseEnd)) / 1000,
  );
  // Still playing a second later, and the clock moved: the transport really runs.
  const before = await page.getByLabel('Position').textContent();
  await page.waitForTimeout(1000);
  const after = await page.getByLabel('Position').textContent();
  if (before === after) throw new Error(`the transport did not move (${before})`);

  const cdp = await context.newCDPSession(page);
  await cdp.send('HeapProfiler.collectGarbage');
  await cdp.send('Performance.enable');
  const { metrics } = await cdp.send('Performance.getMetrics');
  const heap = metrics.find((m) => m.name === 'JSHeapUsedSize')?.value ?? NaN;
  const browserCdp = await browser.newBrowserCDPSession();
  const info = (await browserCdp.send('SystemInfo.getProcessInfo')) as { processInfo: { type: string; id: number }[] };
  const rss = await Promise.all(info.processInfo.map(async (p) => ({ type: p.type, mb: await rssMb(p.id) })));
  const rendererRssMb = Math.max(0, ...rss.filter((p) => p.type === 'renderer').map((p) => p.mb));
  await context.close();
  return {
    openToPlaySec: marks['review-playing'] / 1000,
    openToPlayableSec: marks['review-playable'] / 1000,
    openToEngineSec: marks['review-open'] / 1000,
    previewsInSec,
    openToWholeSec: marks['review-whole'] / 1000,
    jsHeapMb: heap / 1024 / 1024,
    rendererRssMb,
    browserRssMb: rss.reduce((sum, p) => sum + p.mb, 0),
    previewMb: previewBytes / 1024 / 1024,
  };
}

export async function runReviewRoomBench(): Promise<ReviewRoomBenchResult> {
  const stems = await ensureStems();
  const dataDir = await mkdtemp(join(tmpdir(), 'kitlane-bench-review-'));
  const scratch = join(dataDir, 'incoming');
  await mkdir(scratch, { recursive: true });
  let running: Running | null = null;
  let browser: Browser | null = null;
  try {
    running = await startServer(dataDir);
    process.stderr.write('preparing the 12-stem delivery (previews and check)…\n');
    const { deliveryId, songwriter } = await prepareDelivery(running, stems, scratch);
    browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
    const figures = await measureInBrowser(browser, running.url, deliveryId, songwriter);
    return { stems: stems.length, stemSeconds: SECONDS, ...figures };
  } finally {
    await browser?.close();
    await running?.close();
    await rm(dataDir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  const r = await runReviewRoomBench();
  const rows = [
    ['navigation → playing (target ≤ 2 s)', `${r.openToPlaySec.toFixed(2)} s`],
    ['navigation → review room mounted', `${r.openToEngineSec.toFixed(2)} s`],
    ['navigation → last preview received', `${r.previewsInSec.toFixed(2)} s`],
    ['navigation → playable', `${r.openToPlayableSec.toFixed(2)} s`],
    ['navigation → whole stems decoded', `${r.openToWholeSec.toFixed(2)} s`],
    ['JS heap in use (page)', `${r.jsHeapMb.toFixed(0)} MB`],
    ['renderer resident memory (target ≤ ~600 MB)', `${r.rendererRssMb.toFixed(0)} MB`],
    ['all browser processes, resident', `${r.browserRssMb.toFixed(0)} MB`],
    ['previews fetched', `${r.previewMb.toFixed(1)} MB`],
  ];
  process.stdout.write(`review room, ${r.stems} stems × ${r.stemSeconds} s\n${rows.map(([k, v]) => `${k.padEnd(46)} ${v}`).join('\n')}\n`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  main().catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
    process.exitCode = 1;
  });
}
