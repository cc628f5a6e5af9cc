// Stored shapes of the objects the fake serves. Fields follow the public API reference for the subset
// Kitlane uses; nested lists (a charge's refunds, a transfer's reversals, a session's line items) are not
// stored inside their parent but rendered from their own tables, so there is one copy of each fact.

export type Metadata = Record<string, string>;

export interface CheckoutLineItem {
  id: string;
  object: 'item';
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: {
    id: string;
    object: 'price';
    active: boolean;
    currency: string;
    product: string;
    type: 'one_time';
    unit_amount: number;
    unit_amount_decimal: string;
    livemode: false;
    created: number;
    metadata: Metadata;
  };
}

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  allowed_payment_method_types: string[] | null;
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: { email: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'paid' | 'unpaid';
  status: 'open' | 'complete' | 'expired';
  success_url: string | null;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  url: string | null;
}

/** What a session's eventual PaymentIntent inherits (`payment_intent_data`). */
export interface SessionIntentData {
  transfer_group: string | null;
  metadata: Metadata;
  description: string | null;
}

export interface PaymentError {
  type: 'card_error';
  code: string;
  decline_code?: string;
  message: string;
  charge?: string;
  payment_method?: PaymentMethod;
}

export interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  allowed_payment_method_types: string[] | null;
  amount: number;
  amount_capturable: number;
  amount_received: number;
  capture_method: 'automatic';
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  description: string | null;
  last_payment_error: PaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  payment_method: string | null;
  payment_method_types: string[];
  status: 'requires_payment_method' | 'requires_confirmation' | 'succeeded' | 'canceled';
  transfer_group: string | null;
}

export interface CardDetails {
  brand: string;
  last4: string;
  exp_month: number;
  exp_year: number;
  funding: 'credit';
  country: string;
}

export interface PaymentMethod {
  id: string;
  object: 'payment_method';
  type: 'card';
  card: CardDetails;
  created: number;
  livemode: false;
  metadata: Metadata;
}

export interface Charge {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  balance_transaction: string | null;
  captured: boolean;
  created: number;
  currency: string;
  description: string | null;
  failure_code: string | null;
  failure_message: string | null;
  livemode: false;
  metadata: Metadata;
  outcome: { network_status: string; reason: string | null; risk_level: string; seller_message: string; type: string };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: { type: 'card'; card: CardDetails };
  refunded: boolean;
  status: 'succeeded' | 'failed';
  transfer_group: string | null;
}

export interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  balance_transaction: string;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
}

export interface Transfer {
  id: string;
  object: 'transfer';
  amount: number;
  amount_reversed: number;
  balance_transaction: string;
  created: number;
  currency: string;
  description: string | null;
  destination: string;
  destination_payment: null;
  livemode: false;
  metadata: Metadata;
  reversed: boolean;
  source_transaction: string | null;
  source_type: 'card';
  transfer_group: string | null;
}

export interface TransferReversal {
  id: string;
  object: 'transfer_reversal';
  amount: number;
  balance_transaction: string;
  created: number;
  currency: string;
  destination_payment_refund: null;
  metadata: Metadata;
  source_refund: null;
  transfer: string;
}

export type CapabilityStatus = 'active' | 'inactive' | 'pending';

export interface Account {
  id: string;
  object: 'account';
  business_type: string | null;
  capabilities: Record<string, CapabilityStatus>;
  charges_enabled: boolean;
  country: string;
  created: number;
  default_currency: string;
  details_submitted: boolean;
  email: string | null;
  metadata: Metadata;
  payouts_enabled: boolean;
  requirements: {
    currently_due: string[];
    eventually_due: string[];
    past_due: string[];
    pending_verification: string[];
    disabled_reason: string | null;
    current_deadline: null;
    errors: unknown[];
  };
  type: 'express' | 'standard' | 'custom';
}

/** Server-side record of an account link; the public object only exposes its url. */
export interface StoredAccountLink {
  token: string;
  account: string;
  type: 'account_onboarding' | 'account_update';
  refresh_url: string | null;
  return_url: string | null;
  created: number;
  expires_at: number;
  used: boolean;
}

export interface BalanceTransaction {
  id: string;
  object: 'balance_transaction';
  amount: number;
  available_on: number;
  created: number;
  currency: string;
  description: string | null;
  fee: 0;
  fee_details: never[];
  net: number;
  reporting_category: string;
  source: string;
  status: 'available';
  type: 'charge' | 'refund' | 'transfer' | 'transfer_refund' | 'payment' | 'payment_refund';
}

export interface StripeEvent {
  id: string;
  object: 'event';
  account?: string;
  api_version: string;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export type WebhookMode = 'normal' | 'twice' | 'reverse';

export interface Delivery {
  id: string;
  event_id: string;
  type: string;
  status: 'pending' | 'delivered' | 'failed';
  attempts: number;
  /** Epoch milliseconds; retries are scheduled with millisecond back-off. */
  next_attempt_at: number;
  last_status: number | null;
  last_error: string | null;
  delivered_at: number | null;
}

export interface IdempotencyRecord {
  fingerprint: string;
  status: number;
  body: unknown;
  /** Epoch milliseconds, for the 24 h expiry. */
  created_at: number;
}

/** The whole restart-safe state, one JSON document. */
export interface FakeState {
  version: 1;
  platformAccountId: string;
  checkoutSessions: Record<string, CheckoutSession>;
  sessionLineItems: Record<string, CheckoutLineItem[]>;
  sessionIntentData: Record<string, SessionIntentData>;
  paymentIntents: Record<string, PaymentIntent>;
  paymentMethods: Record<string, PaymentMethod>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  transfers: Record<string, Transfer>;
  transferReversals: Record<string, TransferReversal>;
  accounts: Record<string, Account>;
  accountLinks: Record<string, StoredAccountLink>;
  balanceTransactions: Record<string, BalanceTransaction>;
  /** Owner of each balance transaction: 'platform' or a connected account id. */
  balanceTransactionOwner: Record<string, string>;
  /** Available balance per owner ('platform' or acct_…) and currency, in API units. */
  balances: Record<string, Record<string, number>>;
  events: Record<string, StripeEvent>;
  deliveries: Delivery[];
  idempotency: Record<string, IdempotencyRecord>;
  webhookMode: WebhookMode;
}
