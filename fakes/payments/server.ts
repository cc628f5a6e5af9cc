import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { PaymentsCore, type RequestContext } from './core';
import { FakeApiError, errorEnvelope, invalidRequest } from './errors';
import { parseBracketedForm, type FormObject } from './form-encoding';
import { ID_PREFIX, newId } from './ids';
import { lookupIdempotency, requestFingerprint, scopedKey } from './idempotency';
import { DEFAULT_MINIMUM_AMOUNTS } from './money';
import { loadState } from './state-file';
import { WebhookDispatcher } from './webhooks';
import { ResponseHolds } from './held-responses';
import { accountRoutes, checkConnectedAccount, completeOnboarding, usableLink } from './accounts';
import { balanceRoutes } from './balance';
import { checkoutSessionRoutes, expireDueSessions, getSession, payCheckoutSession, successRedirect } from './checkout-sessions';
import { eventRoutes } from './events';
import { paymentIntentRoutes } from './payment-intents';
import { refundRoutes } from './refunds';
import { transferRoutes } from './transfers';
import { checkoutClosedPage, checkoutPage, messagePage, onboardingPage } from './pages';
import type { Route } from './routes-types';
import type { WebhookMode } from './types';

export interface PaymentsFakeOptions {
  /** 0 = a random free port. */
  port?: number;
  host?: string;
  stateFile: string;
  webhookUrl?: string;
  webhookSecret?: string;
  /** Base URL of the hosted pages when the fake is reached through another address. */
  publicUrl?: string;
  /** Webhook back-off base: the n-th retry waits retryBaseMs × 2^(n−1). */
  retryBaseMs?: number;
  maxWebhookAttempts?: number;
  /** Overrides and additions to the minimum charge table (currency → API units). */
  minimumAmounts?: Record<string, number>;
}

export interface PaymentsFake {
  url: string;
  port: number;
  close(): Promise<void>;
  setWebhookUrl(url: string | null): void;
}

export const DEFAULT_WEBHOOK_SECRET = 'whsec_kitlane_local';
/** Version stamped on events when a request names none: the one the installed SDK pins. */
const DEFAULT_API_VERSION = '2026-10-28.endive';
const MAX_BODY_BYTES = 1024 * 1024;
const EXPIRY_SWEEP_MS = 1000;

const ROUTES: Route[] = [
  ...checkoutSessionRoutes,
  ...paymentIntentRoutes,
  ...refundRoutes,
  ...transferRoutes,
  ...accountRoutes,
  ...balanceRoutes,
  ...eventRoutes,
];

interface CompiledRoute {
  route: Route;
  regex: RegExp;
  names: string[];
}

function compileRoutes(routes: Route[]): CompiledRoute[] {
  return routes.map((route) => {
    const names: string[] = [];
    const source = route.pattern.replace(/:([a-zA-Z]+)/g, (_, name: string) => {
      names.push(name);
      return '([^/]+)';
    });
    return { route, regex: new RegExp(`^${source}$`), names };
  });
}

const COMPILED = compileRoutes(ROUTES);

function matchRoute(method: string, pathname: string): { route: Route; path: Record<string, string> } | { methodMismatch: true } | null {
  let sawPath = false;
  for (const compiled of COMPILED) {
    const match = compiled.regex.exec(pathname);
    if (!match) continue;
    sawPath = true;
    if (compiled.route.method !== method) continue;
    const path = Object.fromEntries(compiled.names.map((name, index) => [name, decodeURIComponent(match[index + 1])]));
    return { route: compiled.route, path };
  }
  return sawPath ? { methodMismatch: true } : null;
}

interface Reply {
  status: number;
  body: unknown;
  headers?: Record<string, string>;
}

/** Bearer (what the SDK sends) or Basic with the key as user name (what curl -u sends). */
function secretKeyFrom(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value] = header.split(' ', 2);
  if (!value) return null;
  if (scheme.toLowerCase() === 'bearer') return value.trim();
  if (scheme.toLowerCase() === 'basic') return Buffer.from(value, 'base64').toString('utf8').split(':')[0];
  return null;
}

function authenticate(header: string | undefined): void {
  const key = secretKeyFrom(header);
  if (key === null) {
    throw new FakeApiError(401, {
      type: 'invalid_request_error',
      message: "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    });
  }
  if (!key.startsWith('sk_test_')) {
    // Shown masked, as the hosted API does, so logs of failed requests do not leak keys.
    const masked = key.length > 12 ? `${key.slice(0, 8)}${'*'.repeat(key.length - 12)}${key.slice(-4)}` : `${key.slice(0, 3)}****`;
    throw new FakeApiError(401, { type: 'invalid_request_error', code: 'api_key_invalid', message: `Invalid API Key provided: ${masked}. This fake accepts secret test keys (sk_test_…).` });
  }
}

function headerValue(req: IncomingMessage, name: string): string | undefined {
  const value = req.headers[name];
  return Array.isArray(value) ? value[0] : value;
}

async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    const buffer = chunk as Buffer;
    size += buffer.length;
    if (size > MAX_BODY_BYTES) throw invalidRequest('Request body too large.', { status: 413 });
    chunks.push(buffer);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** Parameters of /_fake and page forms: JSON or form encoding. */
function looseParams(req: IncomingMessage, body: string): Record<string, unknown> {
  const type = headerValue(req, 'content-type') ?? '';
  if (type.includes('application/json')) {
    try {
      const parsed: unknown = JSON.parse(body === '' ? '{}' : body);
      return parsed !== null && typeof parsed === 'object' ? (parsed as Record<string, unknown>) : {};
    } catch {
      throw invalidRequest('Body is not valid JSON.');
    }
  }
  return parseBracketedForm(body);
}

class PaymentsFakeServer {
  readonly core: PaymentsCore;
  readonly dispatcher: WebhookDispatcher;
  private webhookUrl: string | null;
  private listeningUrl = '';
  private sweep: NodeJS.Timeout | null = null;
  private readonly holds = new ResponseHolds();

  constructor(private readonly options: PaymentsFakeOptions) {
    this.webhookUrl = options.webhookUrl ?? null;
    const state = loadState(options.stateFile);
    this.dispatcher = new WebhookDispatcher({
      state: () => this.core.state,
      persist: () => this.core.persist(),
      url: () => this.webhookUrl,
      secret: options.webhookSecret ?? DEFAULT_WEBHOOK_SECRET,
      retryBaseMs: options.retryBaseMs ?? 1000,
      maxAttempts: options.maxWebhookAttempts ?? 8,
      timeoutMs: 10_000,
    });
    this.core = new PaymentsCore(
      state,
      options.stateFile,
      {
        baseUrl: () => (options.publicUrl ?? this.listeningUrl).replace(/\/+$/, ''),
        minimums: { ...DEFAULT_MINIMUM_AMOUNTS, ...(options.minimumAmounts ?? {}) },
        defaultApiVersion: DEFAULT_API_VERSION,
        webhooksEnabled: () => this.webhookUrl !== null,
      },
      (events) => this.dispatcher.enqueue(events),
    );
  }

  started(url: string): void {
    this.listeningUrl = url;
    this.core.persist();
    this.sweep = setInterval(() => expireDueSessions(this.core), EXPIRY_SWEEP_MS);
    this.sweep.unref();
    // Deliveries left pending by the previous run continue.
    this.dispatcher.kick();
  }

  setWebhookUrl(url: string | null): void {
    this.webhookUrl = url;
    if (url !== null) this.dispatcher.kick();
  }

  async stop(): Promise<void> {
    if (this.sweep) clearInterval(this.sweep);
    this.holds.release();
    await this.dispatcher.stop();
    this.core.persist();
  }

  async handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const method = req.method ?? 'GET';
    const url = new URL(req.url ?? '/', 'http://fake.local');
    try {
      const body = method === 'POST' ? await readBody(req) : '';
      if (url.pathname.startsWith('/v1/')) return this.answerApi(req, res, method, url, body);
      if (url.pathname.startsWith('/checkout/')) return this.checkoutPage(req, res, method, url.pathname.slice('/checkout/'.length), body);
      if (url.pathname.startsWith('/onboarding/')) return this.onboardingPage(res, method, url.pathname.slice('/onboarding/'.length));
      if (url.pathname.startsWith('/_fake/')) return sendJson(res, await this.fakeControl(req, method, url.pathname, body));
      if (url.pathname === '/' || url.pathname === '/health') return sendJson(res, { status: 200, body: { ok: true } });
      return sendJson(res, { status: 404, body: { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${url.pathname}).` } } });
    } catch (error) {
      if (error instanceof FakeApiError) return sendJson(res, { status: error.status, body: errorEnvelope(error) });
      console.error('payments fake: unexpected error', error);
      return sendJson(res, { status: 500, body: { error: { type: 'api_error', message: 'An unexpected error occurred in the payments fake.' } } });
    }
  }

  /** Sends the API's answer now, or parks it when a test holds answers on this path. */
  private answerApi(req: IncomingMessage, res: ServerResponse, method: string, url: URL, body: string): void {
    const reply = this.api(req, method, url, body);
    if (!this.holds.holds(method, url.pathname)) return sendJson(res, reply);
    const idempotencyKey = headerValue(req, 'idempotency-key') ?? null;
    this.holds.park(res, { method, path: url.pathname, idempotencyKey, status: reply.status }, () => sendJson(res, reply));
  }

  /** The /v1 API: authentication, routing, the Stripe-Account header and idempotency. */
  private api(req: IncomingMessage, method: string, url: URL, body: string): Reply {
    const requestId = newId(ID_PREFIX.request, 14);
    const apiVersion = headerValue(req, 'stripe-version') ?? null;
    const idempotencyKey = method === 'POST' ? (headerValue(req, 'idempotency-key') ?? null) : null;
    const headers: Record<string, string> = { 'request-id': requestId, 'stripe-version': apiVersion ?? DEFAULT_API_VERSION };
    if (idempotencyKey) headers['idempotency-key'] = idempotencyKey;
    try {
      authenticate(headerValue(req, 'authorization'));
      const matched = matchRoute(method, url.pathname);
      if (matched === null || 'methodMismatch' in matched) {
        throw invalidRequest(`Unrecognized request URL (${method}: ${url.pathname}).`, { status: 404 });
      }
      const account = headerValue(req, 'stripe-account') ?? null;
      if (account !== null) {
        if (!matched.route.connectAware) {
          throw invalidRequest('This fake accepts the Stripe-Account header only on /v1/balance, /v1/balance_transactions and /v1/account.', { param: 'Stripe-Account' });
        }
        checkConnectedAccount(this.core, account);
      }
      const params: FormObject = method === 'POST' ? parseBracketedForm(body) : parseBracketedForm(url.search.slice(1));
      const context: RequestContext = { requestId, idempotencyKey, apiVersion };
      const run = (): Reply => ({ status: 200, body: matched.route.handle(this.core, { method, params, path: matched.path, account }) });
      // Reads do not write the state file; the one read that changes state (lazy session expiry) runs its own action.
      const reply =
        method === 'GET' ? run() : idempotencyKey === null ? this.core.action(context, run) : this.idempotent(context, account, idempotencyKey, method, url.pathname, params, run);
      return { ...reply, headers: { ...headers, ...(reply.headers ?? {}) } };
    } catch (error) {
      if (error instanceof FakeApiError) return { status: error.status, body: errorEnvelope(error), headers };
      throw error;
    }
  }

  /** Replays the stored response for a repeated key; stores the outcome of requests that ran. */
  private idempotent(context: RequestContext, account: string | null, key: string, method: string, path: string, params: FormObject, run: () => Reply): Reply {
    return this.core.action(context, () => {
      const scoped = scopedKey(account, key);
      const fingerprint = requestFingerprint(method, path, params);
      const found = lookupIdempotency(this.core.state, scoped, key, fingerprint, Date.now());
      if (found.kind === 'replay') return { status: found.record.status, body: found.record.body, headers: { 'idempotent-replayed': 'true' } };
      let reply: Reply;
      try {
        reply = run();
      } catch (error) {
        if (!(error instanceof FakeApiError) || error.stage !== 'execution') throw error;
        reply = { status: error.status, body: errorEnvelope(error) };
      }
      this.core.state.idempotency[scoped] = { fingerprint, status: reply.status, body: reply.body, created_at: Date.now() };
      return reply;
    });
  }

  private checkoutPage(req: IncomingMessage, res: ServerResponse, method: string, sessionId: string, body: string): void {
    const session = this.core.state.checkoutSessions[sessionId] ? getSession(this.core, sessionId) : undefined;
    if (!session) return sendHtml(res, 404, messagePage('Checkout not found', 'There is no checkout session at this address.'));
    const items = this.core.state.sessionLineItems[session.id] ?? [];
    if (method === 'GET') {
      if (session.status !== 'open') return sendHtml(res, session.status === 'expired' ? 410 : 200, checkoutClosedPage(session, items, successRedirect(session)));
      return sendHtml(res, 200, checkoutPage(session, items, null));
    }
    if (method !== 'POST') return sendHtml(res, 405, messagePage('Not allowed', 'Use GET or POST.'));
    const card = String(looseParams(req, body).card ?? '');
    const result = payCheckoutSession(this.core, session.id, card);
    if (result.ok) {
      if (result.redirect) return redirect(res, 303, result.redirect);
      return sendHtml(res, 200, checkoutClosedPage(session, items, null));
    }
    if (session.status !== 'open') return sendHtml(res, result.status, checkoutClosedPage(session, items, successRedirect(session)));
    return sendHtml(res, result.status, checkoutPage(session, items, result.error, card));
  }

  private onboardingPage(res: ServerResponse, method: string, token: string): void {
    const found = usableLink(this.core, token);
    if (!found) return sendHtml(res, 404, messagePage('Link not found', 'This onboarding link does not exist.'));
    const { link, usable } = found;
    if (!usable) {
      if (link.refresh_url) return redirect(res, 302, link.refresh_url);
      return sendHtml(res, 410, messagePage('Link expired', 'This onboarding link has expired or was already used. Ask the site for a new one.'));
    }
    const account = this.core.state.accounts[link.account];
    if (method === 'GET') return sendHtml(res, 200, onboardingPage(account));
    if (method !== 'POST') return sendHtml(res, 405, messagePage('Not allowed', 'Use GET or POST.'));
    this.core.action({ requestId: null, idempotencyKey: null, apiVersion: null }, () => {
      link.used = true;
      completeOnboarding(this.core, account);
    });
    if (link.return_url) return redirect(res, 303, link.return_url);
    return sendHtml(res, 200, messagePage('Onboarding complete', 'Payouts are enabled for this test account.'));
  }

  /** Test controls under /_fake (no authentication: loopback test tooling only). */
  private async fakeControl(req: IncomingMessage, method: string, pathname: string, body: string): Promise<Reply> {
    const pay = /^\/_fake\/checkout\/([^/]+)\/pay$/.exec(pathname);
    if (pay && method === 'POST') {
      const sessionId = decodeURIComponent(pay[1]);
      if (!this.core.state.checkoutSessions[sessionId]) return { status: 404, body: { ok: false, error: { code: 'resource_missing', message: `No such checkout.session: '${sessionId}'` } } };
      const result = payCheckoutSession(this.core, sessionId, String(looseParams(req, body).card ?? ''));
      return result.ok ? { status: 200, body: { ok: true, redirect: result.redirect } } : { status: result.status, body: { ok: false, error: result.error } };
    }
    const onboard = /^\/_fake\/accounts\/([^/]+)\/complete-onboarding$/.exec(pathname);
    if (onboard && method === 'POST') {
      const account = this.core.state.accounts[decodeURIComponent(onboard[1])];
      if (!account) return { status: 404, body: { ok: false, error: { code: 'resource_missing', message: 'No such account' } } };
      this.core.action({ requestId: null, idempotencyKey: null, apiVersion: null }, () => completeOnboarding(this.core, account));
      return { status: 200, body: { ok: true } };
    }
    if (pathname === '/_fake/webhooks/mode' && method === 'POST') {
      const mode = looseParams(req, body).mode;
      if (mode !== 'normal' && mode !== 'twice' && mode !== 'reverse') throw invalidRequest('mode must be one of normal, twice, reverse', { param: 'mode' });
      this.dispatcher.setMode(mode as WebhookMode);
      return { status: 200, body: { ok: true, mode } };
    }
    // Hold the answers to POSTs on one API path (the work is done and saved, only the answer waits).
    if (pathname === '/_fake/responses/hold' && method === 'POST') {
      const path = looseParams(req, body).path;
      if (typeof path !== 'string' || !path.startsWith('/v1/')) throw invalidRequest('path must be an API path such as /v1/transfers', { param: 'path' });
      this.holds.hold(path);
      return { status: 200, body: { ok: true, holding: path } };
    }
    if (pathname === '/_fake/responses/held' && method === 'GET') return { status: 200, body: { object: 'list', data: this.holds.held() } };
    if (pathname === '/_fake/responses/release' && method === 'POST') return { status: 200, body: { ok: true, released: this.holds.release() } };
    if (pathname === '/_fake/webhooks/flush' && method === 'POST') return { status: 200, body: { ok: true, ...(await this.dispatcher.flush()) } };
    if (pathname === '/_fake/webhooks/deliveries' && method === 'GET') {
      return { status: 200, body: { object: 'list', mode: this.core.state.webhookMode, data: this.core.state.deliveries } };
    }
    return { status: 404, body: { ok: false, error: { code: 'not_found', message: `Unknown test control (${method} ${pathname}).` } } };
  }
}

function sendJson(res: ServerResponse, reply: Reply): void {
  const payload = JSON.stringify(reply.body, null, 2);
  res.writeHead(reply.status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...(reply.headers ?? {}) });
  res.end(payload);
}

function sendHtml(res: ServerResponse, status: number, html: string): void {
  res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
  res.end(html);
}

function redirect(res: ServerResponse, status: 302 | 303, location: string): void {
  res.writeHead(status, { location, 'content-type': 'text/plain; charset=utf-8' });
  res.end(`Redirecting to ${location}`);
}

function urlFor(host: string, port: number): string {
  const shown = host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host.includes(':') ? `[${host}]` : host;
  return `http://${shown}:${port}`;
}

/** Starts the fake; state is loaded from (and saved to) `stateFile`. */
export async function startPaymentsFake(options: PaymentsFakeOptions): Promise<PaymentsFake> {
  const fake = new PaymentsFakeServer(options);
  const host = options.host ?? '127.0.0.1';
  const server: Server = createServer((req, res) => {
    void fake.handle(req, res);
  });
  server.keepAliveTimeout = 5000;
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const port = (server.address() as AddressInfo).port;
  const url = urlFor(host, port);
  fake.started(url);
  let closing: Promise<void> | null = null;
  return {
    url,
    port,
    setWebhookUrl: (next) => fake.setWebhookUrl(next),
    close: () => {
      closing ??= (async () => {
        await fake.stop();
        await new Promise<void>((resolve, reject) => {
          server.close((error) => (error ? reject(error) : resolve()));
          server.closeAllConnections();
        });
      })();
      return closing;
    },
  };
}
