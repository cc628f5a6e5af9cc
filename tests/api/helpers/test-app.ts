import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseEnv } from '../../../server/env';
import { boot, type Running } from '../../../server/boot';
import type { Limits } from '../../../server/http/rate-limit';
import type { CaughtMail } from '../../../fakes/mail/server';

export type TestApp = Running & { dataDir: string; client(): ApiClient; waitForMail(to: string, subject?: RegExp): Promise<CaughtMail> };

/** The real app in-process on a random port with a fresh SQLite file and the real mail catcher. */
export async function startTestApp(opts: { seed?: boolean; limits?: Partial<Limits>; env?: Record<string, string>; clientDist?: string } = {}): Promise<TestApp> {
  const dataDir = mkdtempSync(join(tmpdir(), 'kitlane-api-'));
  const env = parseEnv({
    ...process.env,
    NODE_ENV: 'test',
    DATA_DIR: dataDir,
    LOG_LEVEL: 'silent',
    SEED_DEMO: opts.seed ? 'true' : 'false',
    APP_URL: 'http://kitlane.test',
    ...opts.env,
  });
  const running = await boot({ env, randomPorts: true, quiet: true, appDeps: { limits: opts.limits, jobOptions: { pollMs: 50, backoffBaseMs: 100 }, ...(opts.clientDist ? { clientDist: opts.clientDist } : {}) } });
  const close = running.close;
  return {
    ...running,
    dataDir,
    client: () => new ApiClient(running.url),
    async waitForMail(to, subject) {
      const deadline = Date.now() + 10_000;
      while (Date.now() < deadline) {
        const found = running.mail?.messages().find((m) => [...m.to, ...(m.envelopeTo ?? [])].some((a) => a.toLowerCase() === to.toLowerCase()) && (!subject || subject.test(m.subject)));
        if (found) return found;
        await new Promise((r) => setTimeout(r, 50));
      }
      throw new Error(`no mail to ${to} matching ${subject} arrived`);
    },
    async close() {
      await close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export type ApiResponse<T = any> = { status: number; body: T; headers: Headers };

/** A fetch wrapper with its own cookie jar: one instance = one browser session. */
export class ApiClient {
  private cookie = '';
  constructor(private readonly base: string) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    const init: RequestInit = { method, headers: { ...headers } };
    if (this.cookie) (init.headers as Record<string, string>).cookie = this.cookie;
    if (body !== undefined) {
      (init.headers as Record<string, string>)['content-type'] ??= 'application/json';
      init.body = typeof body === 'string' ? body : JSON.stringify(body);
    }
    const res = await fetch(this.base + path, init);
    for (const c of res.headers.getSetCookie()) {
      const pair = c.split(';')[0];
      const [name, value] = pair.split('=');
      if (name === 'kitlane_session') this.cookie = value ? pair : '';
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON: keep the text */
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }
  get<T = any>(path: string) {
    return this.request<T>('GET', path);
  }
  post<T = any>(path: string, body?: unknown, headers?: Record<string, string>) {
    return this.request<T>('POST', path, body ?? {}, headers);
  }
  patch<T = any>(path: string, body?: unknown) {
    return this.request<T>('PATCH', path, body ?? {});
  }
  put<T = any>(path: string, body?: unknown) {
    return this.request<T>('PUT', path, body ?? {});
  }
  delete<T = any>(path: string) {
    return this.request<T>('DELETE', path);
  }
  get hasSession() {
    return this.cookie !== '';
  }
}

export function tokenFromMail(mail: CaughtMail, path: string): string {
  const link = mail.links.find((l) => l.includes(path));
  if (!link) throw new Error(`no ${path} link in mail "${mail.subject}"`);
  return new URL(link).searchParams.get('token')!;
}

export const DEMO_PASSWORD = 'kitlane-demo-pass';

export async function signUp(app: TestApp, who: { email: string; roles: string[]; displayName?: string; verify?: boolean }) {
  const c = app.client();
  const res = await c.post('/api/auth/signup', {
    email: who.email,
    password: 'a-long-fine-pass-1',
    displayName: who.displayName ?? who.email.split('@')[0],
    roles: who.roles,
  });
  if (res.status !== 201) throw new Error(`signup failed: ${res.status} ${JSON.stringify(res.body)}`);
  if (who.verify !== false) {
    const mail = await app.waitForMail(who.email, /Confirm your email/);
    const v = await c.post('/api/auth/verify-email', { token: tokenFromMail(mail, '/verify-email') });
    if (v.status !== 200) throw new Error(`verify failed: ${v.status}`);
  }
  return { client: c, user: res.body.user as { id: string; email: string } };
}
