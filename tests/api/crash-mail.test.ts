// Crash and fault recovery with real processes: the server and the mail catcher each run in their own process
// and are killed with SIGKILL. A sign-up made while the mail catcher is down still succeeds (the mail waits in
// the outbox), the server is then killed and restarted on the same data, the catcher comes back on the same
// port, and the confirmation mail arrives exactly once.
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { appEnv, freePort, killAll, killHard, startProcess, tempDataDir, waitFor } from './helpers/processes';

const data = tempDataDir();
const dataDir = data.dir;

afterAll(async () => {
  await killAll();
  data.remove();
});

type Mail = { to: string[]; subject: string };

describe('crash recovery: mail outbox across a dead mail server and a killed app server', () => {
  it('queues the sign-up mail while the mail server is down and delivers it once after both come back', async () => {
    const [appPort, smtpPort, webPort] = [await freePort(), await freePort(), await freePort()];
    const mailEnv = { MAIL_SMTP_PORT: String(smtpPort), MAIL_WEB_PORT: String(webPort) };
    const env = { ...appEnv({ dataDir, port: appPort, mailSmtpPort: smtpPort }), MAIL_WEB_PORT: String(webPort) };
    const base = `http://127.0.0.1:${appPort}`;
    const startMail = () => startProcess('fakes/mail/main.ts', mailEnv, /mail catcher: SMTP/);
    const startApp = () => startProcess('server/index.ts', env, /Kitlane is running/);

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
