import { createHmac } from 'node:crypto';
import { ID_PREFIX, newId } from './ids';
import type { Delivery, FakeState, StripeEvent, WebhookMode } from './types';

/** REFERENCES.md: `Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256(secret, "<t>.<raw body>")>`. */
export function signatureHeader(secret: string, payload: string, timestamp: number): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

export interface DispatcherOptions {
  state: () => FakeState;
  persist: () => void;
  url: () => string | null;
  secret: string;
  /** Delay after the n-th failed attempt is retryBaseMs × 2^(n−1). */
  retryBaseMs: number;
  maxAttempts: number;
  /** Per-attempt timeout; a receiver that hangs counts as a failure. */
  timeoutMs: number;
}

export interface FlushSummary {
  attempted: number;
  delivered: number;
  failed: number;
  pending: number;
}

/**
 * Delivers events one at a time in queue order, so the 'reverse' mode is observable, and keeps the queue in
 * the state file so pending deliveries survive a restart.
 */
export class WebhookDispatcher {
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<void> | null = null;
  private stopped = false;
  private inFlight: AbortController | null = null;

  constructor(private readonly options: DispatcherOptions) {}

  /** Queues one action's events according to the current mode; the caller saves the state. */
  enqueue(events: StripeEvent[]): void {
    const state = this.options.state();
    if (this.options.url() === null) return;
    const ordered = orderForMode(events, state.webhookMode);
    const now = Date.now();
    for (const event of ordered) state.deliveries.push(newDelivery(event, now));
    // Delivery starts on the next turn, after the caller's save.
    setImmediate(() => this.kick());
  }

  setMode(mode: WebhookMode): void {
    this.options.state().webhookMode = mode;
    this.options.persist();
  }

  /** Starts delivering what is due now; later retries are scheduled by timer. */
  kick(): void {
    if (this.stopped || this.running) return;
    this.running = this.drain(false).finally(() => {
      this.running = null;
      this.schedule();
    });
  }

  /** Attempts every pending delivery once, now, ignoring back-off; resolves when done. */
  async flush(): Promise<FlushSummary> {
    while (this.running) await this.running;
    const summary: FlushSummary = { attempted: 0, delivered: 0, failed: 0, pending: 0 };
    const run = this.drain(true, summary);
    this.running = run.finally(() => {
      this.running = null;
    });
    await this.running;
    this.schedule();
    summary.pending = this.options.state().deliveries.filter((d) => d.status === 'pending').length;
    return summary;
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.inFlight?.abort();
    while (this.running) await this.running.catch(() => undefined);
  }

  private schedule(): void {
    if (this.stopped) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (this.options.url() === null) return;
    const pending = this.options.state().deliveries.filter((d) => d.status === 'pending');
    if (pending.length === 0) return;
    const next = Math.min(...pending.map((d) => d.next_attempt_at));
    this.timer = setTimeout(() => {
      this.timer = null;
      this.kick();
    }, Math.max(0, next - Date.now()));
    this.timer.unref();
  }

  private async drain(ignoreBackoff: boolean, summary?: FlushSummary): Promise<void> {
    const visited = new Set<string>();
    for (;;) {
      if (this.stopped) return;
      const url = this.options.url();
      if (url === null) return;
      const now = Date.now();
      const delivery = this.options
        .state()
        .deliveries.find((d) => d.status === 'pending' && !visited.has(d.id) && (ignoreBackoff || d.next_attempt_at <= now));
      if (!delivery) return;
      visited.add(delivery.id);
      const outcome = await this.attempt(url, delivery);
      if (outcome === 'aborted') return;
      if (summary) {
        summary.attempted += 1;
        if (delivery.status === 'delivered') summary.delivered += 1;
        if (delivery.status === 'failed') summary.failed += 1;
      }
    }
  }

  private async attempt(url: string, delivery: Delivery): Promise<'done' | 'aborted'> {
    const event = this.options.state().events[delivery.event_id];
    if (!event) {
      delivery.status = 'failed';
      delivery.last_error = 'event no longer stored';
      this.options.persist();
      return 'done';
    }
    const payload = JSON.stringify(event, null, 2);
    const header = signatureHeader(this.options.secret, payload, Math.floor(Date.now() / 1000));
    const controller = new AbortController();
    this.inFlight = controller;
    const timeout = setTimeout(() => controller.abort(), this.options.timeoutMs);
    let status: number | null = null;
    let error: string | null = null;
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': header, 'user-agent': 'Kitlane-PaymentsFake/1.0' },
        body: payload,
        signal: controller.signal,
      });
      status = response.status;
      // Drain the body so the connection is released.
      await response.arrayBuffer().catch(() => undefined);
    } catch (caught) {
      error = caught instanceof Error ? describeFetchError(caught) : String(caught);
    } finally {
      clearTimeout(timeout);
      this.inFlight = null;
    }
    // An attempt cut short by close() is not counted: it is tried again after a restart.
    if (this.stopped) return 'aborted';
    recordAttempt(delivery, status, error, this.options);
    this.options.persist();
    return 'done';
  }
}

function describeFetchError(error: Error): string {
  const cause = (error as Error & { cause?: { code?: string; message?: string } }).cause;
  return cause?.code ?? cause?.message ?? error.message;
}

function recordAttempt(delivery: Delivery, status: number | null, error: string | null, options: DispatcherOptions): void {
  delivery.attempts += 1;
  delivery.last_status = status;
  delivery.last_error = error ?? (status !== null && (status < 200 || status > 299) ? `HTTP ${status}` : null);
  if (status !== null && status >= 200 && status <= 299) {
    delivery.status = 'delivered';
    delivery.delivered_at = Date.now();
    return;
  }
  if (delivery.attempts >= options.maxAttempts) {
    delivery.status = 'failed';
    return;
  }
  delivery.next_attempt_at = Date.now() + retryDelayMs(options.retryBaseMs, delivery.attempts);
}

/** Back-off after the n-th failed attempt: base × 2^(n−1) (n ≥ 1). */
export function retryDelayMs(baseMs: number, failedAttempts: number): number {
  return baseMs * 2 ** (failedAttempts - 1);
}

/** 'twice' sends every event two times; 'reverse' sends one action's events last-first. */
export function orderForMode(events: StripeEvent[], mode: WebhookMode): StripeEvent[] {
  if (mode === 'reverse') return [...events].reverse();
  if (mode === 'twice') return events.flatMap((event) => [event, event]);
  return [...events];
}

function newDelivery(event: StripeEvent, now: number): Delivery {
  return {
    id: newId(ID_PREFIX.delivery),
    event_id: event.id,
    type: event.type,
    status: 'pending',
    attempts: 0,
    next_attempt_at: now,
    last_status: null,
    last_error: null,
    delivered_at: null,
  };
}
