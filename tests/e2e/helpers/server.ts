// The real Kitlane server for browser tests: the client built once into dist/, then boot() with a fresh
// data directory, the demo seed and the real mail catcher. The app listens on a port picked here so
// APP_URL (used in mailed links) is exactly the address the browser opens.
import { mkdtempSync, readdirSync, rmSync, statSync, existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { boot } from '../../../server/boot';
import { parseEnv } from '../../../server/env';
import type { MailCatcher, CaughtMail } from '../../../fakes/mail/server';

const ROOT = resolve('.');
const CLIENT_INPUTS = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts'];

function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return readdirSync(path).reduce((newest, entry) => Math.max(newest, newestMtime(join(path, entry))), stat.mtimeMs);
}

/** dist/ is reused when it is newer than every client source; otherwise Vite builds it (once per run). */
export function clientBuildIsFresh(root = ROOT): boolean {
  const built = join(root, 'dist', 'index.html');
  if (!existsSync(built)) return false;
  const sources = Math.max(...CLIENT_INPUTS.map((p) => newestMtime(join(root, p))));
  return statSync(built).mtimeMs > sources;
}

let building: Promise<void> | null = null;
export function buildClientOnce(): Promise<void> {
  if (clientBuildIsFresh()) return Promise.resolve();
  building ??= (async () => {
    const { build } = await import('vite');
    await inProductionMode(() => buildProduction(build));
  })();
  return building;
}

/**
 * Runs a Vite build with NODE_ENV=production and puts the old value back. Vitest sets NODE_ENV=test, and Vite
 * keeps an existing NODE_ENV: without this a build ships React's development build (larger, and not what
 * users get). An unset NODE_ENV is unset again: assigning undefined to process.env stores the string
 * "undefined", which made every later build in the same process a development build.
 */
export async function inProductionMode<T>(run: () => Promise<T>): Promise<T> {
  const previous = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    return await run();
  } finally {
    if (previous === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = previous;
  }
}

async function buildProduction(build: typeof import('vite').build): Promise<void> {
  await build({
    root: ROOT,
    configFile: join(ROOT, 'vite.config.ts'),
    logLevel: 'warn',
    mode: 'production',
    // The build shares the machine with the test run; its "slow plugin" timing report is noise here.
    build: { rolldownOptions: { checks: { bundlerTimings: false } } },
  });
}

function freePort(): Promise<number> {
  return new Promise((res, rej) => {
    const probe = createServer();
    probe.once('error', rej);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => res(port));
    });
  });
}

export type TestServer = {
  url: string;
  mailWebUrl: string;
  mail: MailCatcher;
  /** Waits for the newest mail to `to` whose subject matches (the outbox sends from a job, not inline). */
  waitForMail(to: string, subject: RegExp, timeoutMs?: number): Promise<CaughtMail>;
  close(): Promise<void>;
};

export async function startTestServer(): Promise<TestServer> {
  await buildClientOnce();
  const dataDir = mkdtempSync(join(tmpdir(), 'kitlane-e2e-'));
  const [port, smtpPort, webPort, paymentsPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const appUrl = `http://127.0.0.1:${port}`;
  const env = parseEnv({
    ...process.env,
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    PORT: String(port),
    APP_URL: appUrl,
    MAIL_SMTP_PORT: String(smtpPort),
    MAIL_WEB_PORT: String(webPort),
    PAYMENTS_PORT: String(paymentsPort),
    DATA_DIR: dataDir,
    LOG_LEVEL: 'silent',
    SEED_DEMO: 'true',
    START_FAKES: 'true',
    SMTP_URL: '',
  });
  const running = await boot({ env, randomPorts: false, quiet: true });
  const mail = running.mail;
  if (!mail || !running.mailWebUrl) throw new Error('boot() did not start the mail catcher');

  return {
    url: running.url,
    mailWebUrl: running.mailWebUrl,
    mail,
    async waitForMail(to, subject, timeoutMs = 20_000) {
      const deadline = Date.now() + timeoutMs;
      while (Date.now() < deadline) {
        const found = mail.messages().find((m) => m.to.includes(to) && subject.test(m.subject));
        if (found) return found;
        await new Promise((r) => setTimeout(r, 100));
      }
      throw new Error(`No mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    },
    async close() {
      await running.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
