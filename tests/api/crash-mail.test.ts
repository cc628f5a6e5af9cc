// Crash and fault recovery with real processes: the server and the mail catcher each run in their own process
// and are killed with SIGKILL. A sign-up made while the mail catcher is down still succeeds (the mail waits in
// the outbox), the server is then killed and restarted on the same data, the catcher comes back on the same
// port, and the confirmation mail arrives exactly once.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';

const children = new Set<ChildProcess>();
const dataDir = mkdtempSync(join(tmpdir(), 'kitlane-crash-'));

afterAll(async () => {
  for (const c of children) await killHard(c);
  rmSync(dataDir, { recursive: true, force: true });
});

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

/** Starts `tsx <script>` with env; resolves once its stdout shows `ready`. */
function startProcess(script: string, env: Record<string, string>, ready: RegExp): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', script], { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  children.add(child);
  return new Promise((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`${script} not ready in 60 s: ${out.slice(-500)}`)), 60_000);
    const onData = (d: Buffer) => {
      out += d.toString();
      if (ready.test(out)) {
        clearTimeout(timer);
        resolve(child);
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`${script} exited ${code}: ${out.slice(-1000)}`));
    });
  });
}

async function killHard(child: ChildProcess): Promise<void> {
  children.delete(child);
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGKILL');
  await exited;
}

async function waitFor<T>(what: string, probe: () => Promise<T | null> | T | null, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v !== null) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

type Mail = { to: string[]; subject: string };

describe('crash recovery: mail outbox across a dead mail server and a killed app server', () => {
  it('queues the sign-up mail while the mail server is down and delivers it once after both come back', async () => {
    const [appPort, smtpPort, webPort] = [await freePort(), await freePort(), await freePort()];
    const mailEnv = { MAIL_SMTP_PORT: String(smtpPort), MAIL_WEB_PORT: String(webPort) };
    const appEnv = { ...mailEnv, NODE_ENV: 'test', PORT: String(appPort), DATA_DIR: dataDir, START_FAKES: 'false', SEED_DEMO: 'false', LOG_LEVEL: 'error', APP_URL: `http://127.0.0.1:${appPort}` };
    const base = `http://127.0.0.1:${appPort}`;
    const startMail = () => startProcess('fakes/mail/main.ts', mailEnv, /mail catcher: SMTP/);
    const startApp = () => startProcess('server/index.ts', appEnv, /Kitlane is running/);

    let mail = await startMail();
    let server = await startApp();
    await killHard(mail);

    const email = 'outbox-crash@kitlane.test';
    const signup = await fetch(`${base}/api/auth/signup`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'a-long-fine-pass-1', displayName: 'Outbox Crash', roles: ['songwriter'] }) });
    expect(signup.status).toBe(201);

    // The mail job has tried at least once and failed against the dead SMTP port, and waits to retry.
    const db = new Database(join(dataDir, 'kitlane.db'), { readonly: true, fileMustExist: true });
    const job = await waitFor('a failed mail attempt', () => {
      const row = db.prepare(`SELECT status, attempts, last_error AS lastError FROM jobs WHERE kind = 'mail.send' ORDER BY id DESC LIMIT 1`).get() as { status: string; attempts: number; lastError: string | null } | undefined;
      return row && row.attempts >= 1 && row.lastError ? row : null;
    });
    expect(job.status).toBe('queued');
    db.close();

    await killHard(server);
    mail = await startMail();
    server = await startApp();

    const delivered = await waitFor('the confirmation mail', async () => {
      const res = await fetch(`http://127.0.0.1:${webPort}/api/messages?to=${encodeURIComponent(email)}`);
      const list = (await res.json()) as Mail[];
      const found = list.filter((m) => /Confirm your email/.test(m.subject));
      return found.length ? found : null;
    }, 60_000);
    // Give a duplicate (a second send after the restart) a moment to show up before counting.
    await new Promise((r) => setTimeout(r, 1500));
    const all = (await (await fetch(`http://127.0.0.1:${webPort}/api/messages?to=${encodeURIComponent(email)}`)).json()) as Mail[];
    expect(delivered.length).toBe(1);
    expect(all.filter((m) => /Confirm your email/.test(m.subject))).toHaveLength(1);

    await killHard(server);
    await killHard(mail);
  }, 180_000);
});
