// Real processes for the crash tests: the server, the payment fake and the mail catcher each run as
// `node --import tsx <script>` and are killed with SIGKILL, the way a power cut or the OOM killer ends them.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const children = new Set<ChildProcess>();

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

/** Starts `tsx <script>` with env; resolves once its output shows `ready`. */
export function startProcess(script: string, env: Record<string, string>, ready: RegExp, timeoutMs = 60_000): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', script], { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  children.add(child);
  return new Promise((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`${script} not ready in ${timeoutMs / 1000} s: ${out.slice(-500)}`)), timeoutMs);
    const onData = (d: Buffer) => {
      out += d.toString();
      if (ready.test(out)) {
        clearTimeout(timer);
        resolve(child);
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
    child.once('exit', (code, signal) => {
      clearTimeout(timer);
      children.delete(child);
      reject(new Error(`${script} exited ${code ?? signal}: ${out.slice(-1000)}`));
    });
  });
}

/** SIGKILL: no shutdown handler runs, open requests and transactions are cut where they are. */
export async function killHard(child: ChildProcess): Promise<void> {
  children.delete(child);
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGKILL');
  await exited;
}

/** Kills every process this file started that is still alive (for afterAll). */
export async function killAll(): Promise<void> {
  for (const child of [...children]) await killHard(child);
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined> | T | null | undefined, timeoutMs = 30_000, everyMs = 200): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v !== null && v !== undefined) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

export function tempDataDir(): { dir: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), 'kitlane-crash-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

export type AppProcessOptions = {
  dataDir: string;
  port: number;
  /** Where the payment fake listens (its own process); the server then starts no fakes of its own. */
  paymentsPort?: number;
  mailSmtpPort?: number;
  env?: Record<string, string>;
};

/** The environment of `server/index.ts` for a crash test: no fakes in-process, no demo seed, quiet logs. */
export function appEnv(opts: AppProcessOptions): Record<string, string> {
  return {
    NODE_ENV: 'test',
    PORT: String(opts.port),
    DATA_DIR: opts.dataDir,
    START_FAKES: 'false',
    SEED_DEMO: 'false',
    LOG_LEVEL: 'error',
    APP_URL: `http://127.0.0.1:${opts.port}`,
    // Nothing listens here unless the test starts a mail catcher: mail waits in the outbox.
    MAIL_SMTP_PORT: String(opts.mailSmtpPort ?? 9),
    ...(opts.paymentsPort ? { PAYMENTS_PORT: String(opts.paymentsPort) } : {}),
    ...opts.env,
  };
}

export const startApp = (opts: AppProcessOptions) => startProcess('server/index.ts', appEnv(opts), /Kitlane is running/);

/** The payment fake as its own process, with its state file in the data dir and webhooks to the app. */
export function startPaymentsFakeProcess(opts: { dataDir: string; port: number; appPort: number }): Promise<ChildProcess> {
  return startProcess(
    'fakes/payments/main.ts',
    {
      PAYMENTS_PORT: String(opts.port),
      PAYMENTS_STATE_FILE: join(opts.dataDir, 'payments-fake.json'),
      STRIPE_WEBHOOK_URL: `http://127.0.0.1:${opts.appPort}/api/webhooks/stripe`,
      PAYMENTS_WEBHOOK_RETRY_BASE_MS: '100',
    },
    /payments fake listening/,
  );
}
