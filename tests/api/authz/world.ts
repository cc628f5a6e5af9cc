import { DEFAULT_LIMITS, type Limits } from '../../../server/http/rate-limit';
import { DEMO_PASSWORD, startTestApp, type ApiClient, type TestApp } from '../helpers/test-app';

// Limits out of the way: these suites sign in many times and measure the rules, not the limiter
// (auth.test.ts covers the limits themselves).
export const RELAXED_LIMITS: Partial<Limits> = Object.fromEntries(Object.entries(DEFAULT_LIMITS).map(([k, v]) => [k, { ...v, limit: 1_000_000 }]));

export async function signInAs(app: TestApp, email: string, password = DEMO_PASSWORD): Promise<ApiClient> {
  const c = app.client();
  const res = await c.post('/api/auth/login', { email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status} ${JSON.stringify(res.body)}`);
  return c;
}

/** The demo world (seeded through the services) with relaxed limits. */
export function startSeededApp(): Promise<TestApp> {
  return startTestApp({ seed: true, limits: RELAXED_LIMITS });
}

/** Stops the job runner once the seed's own jobs are done, so nothing writes behind a test's back. */
export async function quiesceJobs(app: TestApp, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  const due = () => (app.db.$client.prepare(`SELECT count(*) AS n FROM jobs WHERE status IN ('queued', 'running') AND run_at <= ?`).get(Date.now()) as { n: number }).n;
  while (due() > 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
  await app.kitlane.ctx.jobs.stop();
}
