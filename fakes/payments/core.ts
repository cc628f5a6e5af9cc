import { ID_PREFIX, newId, unixNow } from './ids';
import { saveState } from './state-file';
import type { MinimumTable } from './money';
import type { BalanceTransaction, FakeState, StripeEvent } from './types';

export interface CoreConfig {
  /** Base URL of hosted pages (checkout, onboarding): publicUrl or the listening URL. */
  baseUrl: () => string;
  minimums: MinimumTable;
  /** Version stamped on events when the creating request sent no Stripe-Version header. */
  defaultApiVersion: string;
  webhooksEnabled: () => boolean;
}

export interface RequestContext {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string | null;
}

export const PLATFORM = 'platform';

/**
 * Holds the state and the rules every resource shares: one action at a time (handlers are synchronous, so
 * two requests never interleave), events collected per action, one atomic save per action.
 */
export class PaymentsCore {
  private collected: StripeEvent[] | null = null;
  private request: RequestContext = { requestId: null, idempotencyKey: null, apiVersion: null };

  constructor(
    public state: FakeState,
    private readonly stateFile: string,
    readonly config: CoreConfig,
    private readonly onEvents: (events: StripeEvent[]) => void,
  ) {}

  now(): number {
    return unixNow();
  }

  /**
   * Runs one mutation. State is saved and events handed to webhook delivery even when `fn` throws, because
   * a declined card is an error response that still leaves a failed charge and events behind.
   */
  action<T>(request: RequestContext, fn: () => T): T {
    const outer = this.collected;
    if (outer !== null) return fn();
    this.collected = [];
    this.request = request;
    try {
      return fn();
    } finally {
      const events = this.collected;
      this.collected = null;
      this.request = { requestId: null, idempotencyKey: null, apiVersion: null };
      // Deliveries are queued before the save, so one write covers the action and its webhook queue.
      if (events.length > 0) this.onEvents(events);
      this.persist();
    }
  }

  persist(): void {
    saveState(this.stateFile, this.state);
  }

  /** Records an event with a snapshot of the object as it is now. Must run inside `action`. */
  emit(type: string, object: unknown, options: { previous?: Record<string, unknown>; account?: string } = {}): StripeEvent {
    if (this.collected === null) throw new Error(`payments fake: event ${type} emitted outside an action`);
    const event: StripeEvent = {
      id: newId(ID_PREFIX.event),
      object: 'event',
      ...(options.account ? { account: options.account } : {}),
      api_version: this.request.apiVersion ?? this.config.defaultApiVersion,
      created: this.now(),
      data: { object: structuredClone(object), ...(options.previous ? { previous_attributes: options.previous } : {}) },
      livemode: false,
      pending_webhooks: this.config.webhooksEnabled() ? 1 : 0,
      request: { id: this.request.requestId, idempotency_key: this.request.idempotencyKey },
      type,
    };
    this.state.events[event.id] = event;
    this.collected.push(event);
    return event;
  }

  balanceOf(owner: string, currency: string): number {
    return this.state.balances[owner]?.[currency] ?? 0;
  }

  /**
   * Moves money into (positive) or out of (negative) one balance and writes its balance transaction.
   * Funds are available at once and fees are zero in this fake (see docs/decisions/003-payment-fake.md).
   */
  recordMovement(owner: string, movement: { amount: number; currency: string; type: BalanceTransaction['type']; source: string; description?: string | null }): string {
    const balances = (this.state.balances[owner] ??= {});
    balances[movement.currency] = (balances[movement.currency] ?? 0) + movement.amount;
    const created = this.now();
    const txn: BalanceTransaction = {
      id: newId(ID_PREFIX.balanceTransaction),
      object: 'balance_transaction',
      amount: movement.amount,
      available_on: created,
      created,
      currency: movement.currency,
      description: movement.description ?? null,
      fee: 0,
      fee_details: [],
      net: movement.amount,
      reporting_category: REPORTING_CATEGORY[movement.type],
      source: movement.source,
      status: 'available',
      type: movement.type,
    };
    this.state.balanceTransactions[txn.id] = txn;
    this.state.balanceTransactionOwner[txn.id] = owner;
    return txn.id;
  }
}

const REPORTING_CATEGORY: Record<BalanceTransaction['type'], string> = {
  charge: 'charge',
  refund: 'refund',
  transfer: 'transfer',
  transfer_refund: 'transfer_reversal',
  payment: 'charge',
  payment_refund: 'refund',
};
