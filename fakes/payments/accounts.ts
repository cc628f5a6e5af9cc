import { z } from 'zod';
import { FakeApiError, invalidRequest, noSuch } from './errors';
import { ID_PREFIX, newId } from './ids';
import { boolParam, enumParam, expandParam, listParams, metadataParam, parseParams } from './params';
import type { PaymentsCore } from './core';
import { listBody, newestFirst, render } from './render';
import { mergeMetadata } from './refunds';
import type { Account, StoredAccountLink } from './types';
import type { Route } from './routes-types';

const capabilityInputSchema = z.strictObject({ requested: boolParam });

const controllerInputSchema = z.strictObject({
  stripe_dashboard: z.strictObject({ type: enumParam(['express', 'full', 'none']) }).optional(),
  fees: z.strictObject({ payer: enumParam(['account', 'application']) }).optional(),
  losses: z.strictObject({ payments: enumParam(['application', 'stripe']) }).optional(),
  requirement_collection: enumParam(['application', 'stripe']).optional(),
});

export const accountCreateInputSchema = z.strictObject({
  type: enumParam(['express', 'standard', 'custom']).optional(),
  // The newer way to describe an account: who controls it. Only the dashboard type decides anything here.
  controller: controllerInputSchema.optional(),
  country: z.string().length(2).optional(),
  email: z.string().optional(),
  business_type: enumParam(['individual', 'company', 'non_profit', 'government_entity']).optional(),
  capabilities: z.record(z.string(), capabilityInputSchema).optional(),
  default_currency: z.string().optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});
export type AccountCreateInput = z.output<typeof accountCreateInputSchema>;

export const accountLinkCreateInputSchema = z.strictObject({
  account: z.string(),
  type: enumParam(['account_onboarding', 'account_update']),
  refresh_url: z.string().optional(),
  return_url: z.string().optional(),
  collect: enumParam(['currently_due', 'eventually_due']).optional(),
  expand: expandParam,
});

const accountUpdateInputSchema = z.strictObject({ email: z.string().optional(), metadata: metadataParam.optional(), expand: expandParam });
const accountListInputSchema = z.strictObject({ ...listParams });
const retrieveInputSchema = z.strictObject({ expand: expandParam });

/** Default settlement currency by country (common practice; a short table, from memory). */
const COUNTRY_CURRENCY: Record<string, string> = {
  US: 'usd', GB: 'gbp', CA: 'cad', AU: 'aud', NZ: 'nzd', JP: 'jpy', CH: 'chf', SE: 'sek', NO: 'nok', DK: 'dkk', PL: 'pln',
  DE: 'eur', FR: 'eur', ES: 'eur', IT: 'eur', NL: 'eur', BE: 'eur', AT: 'eur', IE: 'eur', PT: 'eur', FI: 'eur',
};

/** What a fresh connected account still has to provide (the usual first requirements). */
const INITIAL_REQUIREMENTS = ['business_type', 'external_account', 'tos_acceptance.date', 'tos_acceptance.ip'];

/** Account links expire a few minutes after creation (public reference, from memory: 5 minutes). */
const ACCOUNT_LINK_LIFETIME_S = 300;

export function getAccount(core: PaymentsCore, id: string): Account {
  const account = core.state.accounts[id];
  if (!account) throw noSuch('account', id);
  return account;
}

const DASHBOARD_TYPE: Record<string, Account['type']> = { express: 'express', full: 'standard', none: 'custom' };

function accountType(input: AccountCreateInput): Account['type'] {
  if (input.type) return input.type;
  const dashboard = input.controller?.stripe_dashboard?.type;
  if (dashboard) return DASHBOARD_TYPE[dashboard];
  throw invalidRequest('Missing required param: type (or controller[stripe_dashboard][type]).', { code: 'parameter_missing', param: 'type' });
}

function createAccount(core: PaymentsCore, params: Parameters<Route['handle']>[1]['params']): unknown {
  const input = parseParams(accountCreateInputSchema, params);
  const type = accountType(input);
  const country = (input.country ?? 'US').toUpperCase();
  const defaultCurrency = input.default_currency?.toLowerCase() ?? COUNTRY_CURRENCY[country];
  if (!defaultCurrency) throw invalidRequest(`This fake has no default currency for country ${country}; pass default_currency.`, { param: 'country' });
  // Express accounts need the transfers capability to be paid; it is requested when the caller names none.
  const requested = Object.entries(input.capabilities ?? { transfers: { requested: true } })
    .filter(([, capability]) => capability.requested)
    .map(([name]) => name);
  const account: Account = {
    id: newId(ID_PREFIX.account, 16),
    object: 'account',
    business_type: input.business_type ?? null,
    capabilities: Object.fromEntries(requested.map((name) => [name, 'inactive'])),
    charges_enabled: false,
    country,
    created: core.now(),
    default_currency: defaultCurrency,
    details_submitted: false,
    email: input.email ?? null,
    metadata: input.metadata ?? {},
    payouts_enabled: false,
    requirements: {
      currently_due: [...INITIAL_REQUIREMENTS],
      eventually_due: [...INITIAL_REQUIREMENTS],
      past_due: [...INITIAL_REQUIREMENTS],
      pending_verification: [],
      disabled_reason: 'requirements.past_due',
      current_deadline: null,
      errors: [],
    },
    type,
  };
  core.state.accounts[account.id] = account;
  return render(core, account, input.expand);
}

/** What the hosted onboarding's "finish" does: everything enabled, nothing due, account.updated sent. */
export function completeOnboarding(core: PaymentsCore, account: Account): void {
  const previous = {
    charges_enabled: account.charges_enabled,
    payouts_enabled: account.payouts_enabled,
    details_submitted: account.details_submitted,
    capabilities: { ...account.capabilities },
    requirements: structuredClone(account.requirements),
  };
  account.charges_enabled = true;
  account.payouts_enabled = true;
  account.details_submitted = true;
  account.capabilities = Object.fromEntries(Object.keys(account.capabilities).map((name) => [name, 'active']));
  if (account.capabilities.transfers === undefined) account.capabilities.transfers = 'active';
  account.requirements = { currently_due: [], eventually_due: [], past_due: [], pending_verification: [], disabled_reason: null, current_deadline: null, errors: [] };
  core.emit('account.updated', account, { previous, account: account.id });
}

function createAccountLink(core: PaymentsCore, params: Parameters<Route['handle']>[1]['params']): unknown {
  const input = parseParams(accountLinkCreateInputSchema, params);
  const account = core.state.accounts[input.account];
  if (!account) throw invalidRequest(`No such account: '${input.account}'`, { code: 'resource_missing', param: 'account' });
  if (input.type === 'account_onboarding' && (!input.refresh_url || !input.return_url)) {
    throw invalidRequest('Missing required param: ' + (input.refresh_url ? 'return_url' : 'refresh_url') + '.', {
      code: 'parameter_missing',
      param: input.refresh_url ? 'return_url' : 'refresh_url',
    });
  }
  const created = core.now();
  const link: StoredAccountLink = {
    token: newId('', 32),
    account: account.id,
    type: input.type,
    refresh_url: input.refresh_url ?? null,
    return_url: input.return_url ?? null,
    created,
    expires_at: created + ACCOUNT_LINK_LIFETIME_S,
    used: false,
  };
  core.state.accountLinks[link.token] = link;
  return { object: 'account_link', created, expires_at: link.expires_at, url: onboardingUrl(core, link.token) };
}

export function onboardingUrl(core: PaymentsCore, token: string): string {
  return `${core.config.baseUrl()}/onboarding/${token}`;
}

/** Links are single-use and short-lived; a stale one sends the person to refresh_url, as the hosted flow does. */
export function usableLink(core: PaymentsCore, token: string): { link: StoredAccountLink; usable: boolean } | undefined {
  const link = core.state.accountLinks[token];
  if (!link) return undefined;
  return { link, usable: !link.used && link.expires_at > core.now() };
}

function updateAccount(core: PaymentsCore, req: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(accountUpdateInputSchema, req.params);
  const account = getAccount(core, req.path.id);
  const previous: Record<string, unknown> = {};
  if (input.email !== undefined) {
    previous.email = account.email;
    account.email = input.email;
  }
  if (input.metadata !== undefined) {
    previous.metadata = account.metadata;
    account.metadata = mergeMetadata(account.metadata, input.metadata);
  }
  if (Object.keys(previous).length > 0) core.emit('account.updated', account, { previous, account: account.id });
  return render(core, account, input.expand);
}

/** `GET /v1/account`: the platform itself, always fully enabled. */
function platformAccount(core: PaymentsCore): Account {
  return {
    id: core.state.platformAccountId,
    object: 'account',
    business_type: 'company',
    capabilities: { card_payments: 'active', transfers: 'active' },
    charges_enabled: true,
    country: 'US',
    created: 0,
    default_currency: 'usd',
    details_submitted: true,
    email: null,
    metadata: {},
    payouts_enabled: true,
    requirements: { currently_due: [], eventually_due: [], past_due: [], pending_verification: [], disabled_reason: null, current_deadline: null, errors: [] },
    type: 'standard',
  };
}

/** The Stripe-Account header must name a connected account of this platform. */
export function checkConnectedAccount(core: PaymentsCore, id: string): void {
  if (!core.state.accounts[id]) {
    throw new FakeApiError(403, {
      type: 'invalid_request_error',
      code: 'account_invalid',
      message: `The provided key does not have access to account '${id}' (or that account does not exist).`,
    });
  }
}

export const accountRoutes: Route[] = [
  { method: 'POST', pattern: '/v1/accounts', handle: (core, req) => createAccount(core, req.params) },
  { method: 'GET', pattern: '/v1/accounts', handle: (core, req) => listBody(core, newestFirst(core.state.accounts), parseParams(accountListInputSchema, req.params), '/v1/accounts') },
  { method: 'GET', pattern: '/v1/accounts/:id', handle: (core, req) => render(core, getAccount(core, req.path.id), parseParams(retrieveInputSchema, req.params).expand) },
  { method: 'POST', pattern: '/v1/accounts/:id', handle: updateAccount },
  {
    method: 'GET',
    pattern: '/v1/account',
    connectAware: true,
    handle: (core, req) => (req.account ? render(core, getAccount(core, req.account)) : platformAccount(core)),
  },
  { method: 'POST', pattern: '/v1/account_links', handle: (core, req) => createAccountLink(core, req.params) },
];
