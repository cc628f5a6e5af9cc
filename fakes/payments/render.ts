import { invalidRequest } from './errors';
import type { PaymentsCore } from './core';

// Rendering turns stored records into response bodies: nested lists are assembled from their own tables,
// and `expand[]` replaces id strings with the objects they name, the way the hosted API does.

export interface ListBody<T = unknown> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

type Renderable = { id: string; object: string };

/** Newest first, as the hosted API lists objects; insertion order of the tables is creation order. */
export function newestFirst<T>(table: Record<string, T>, keep: (item: T) => boolean = () => true): T[] {
  return Object.values(table).filter(keep).reverse();
}

export interface PageParams {
  limit?: number;
  starting_after?: string;
  ending_before?: string;
}

/** Cursor pagination over a newest-first array (limit 1–100, default 10). */
export function paginate<T extends { id: string }>(items: T[], params: PageParams): { page: T[]; has_more: boolean } {
  const limit = params.limit ?? 10;
  if (limit < 1 || limit > 100) throw invalidRequest('This value must be between 1 and 100 (it currently is ' + limit + ').', { code: 'parameter_invalid_integer', param: 'limit' });
  if (params.starting_after !== undefined && params.ending_before !== undefined) {
    throw invalidRequest('You may only specify one of these parameters: ending_before, starting_after.', { param: 'starting_after' });
  }
  if (params.starting_after !== undefined) {
    const index = items.findIndex((item) => item.id === params.starting_after);
    if (index === -1) throw invalidRequest(`No such object: '${params.starting_after}'`, { code: 'resource_missing', param: 'starting_after' });
    const rest = items.slice(index + 1);
    return { page: rest.slice(0, limit), has_more: rest.length > limit };
  }
  if (params.ending_before !== undefined) {
    const index = items.findIndex((item) => item.id === params.ending_before);
    if (index === -1) throw invalidRequest(`No such object: '${params.ending_before}'`, { code: 'resource_missing', param: 'ending_before' });
    const before = items.slice(0, index);
    return { page: before.slice(Math.max(0, before.length - limit)), has_more: before.length > limit };
  }
  return { page: items.slice(0, limit), has_more: items.length > limit };
}

export function listBody<T extends Renderable>(core: PaymentsCore, items: T[], params: PageParams & { expand?: string[] }, url: string): ListBody {
  const { page, has_more } = paginate(items, params);
  const itemExpand = (params.expand ?? []).filter((path) => path.startsWith('data.')).map((path) => path.slice('data.'.length));
  const unexpected = (params.expand ?? []).find((path) => !path.startsWith('data.'));
  if (unexpected !== undefined) throw invalidRequest(`This property cannot be expanded (${unexpected}). List expansions start with data.`, { param: 'expand' });
  return { object: 'list', data: page.map((item) => render(core, item, itemExpand)), has_more, url };
}

/** Lists that are part of an object (a transfer's reversals): first ten, like the hosted API's default. */
export function embeddedList<T extends Renderable>(core: PaymentsCore, items: T[], url: string, expand: string[] = []): ListBody {
  return { object: 'list', data: items.slice(0, 10).map((item) => render(core, item, expand)), has_more: items.length > 10, url };
}

/** Finds any stored object by its id prefix (for expansion). */
export function lookupById(core: PaymentsCore, id: string): Renderable | undefined {
  const s = core.state;
  const tables: Array<[string, Record<string, Renderable>]> = [
    ['cs_', s.checkoutSessions],
    ['pi_', s.paymentIntents],
    ['ch_', s.charges],
    ['re_', s.refunds],
    ['trr_', s.transferReversals],
    ['tr_', s.transfers],
    ['acct_', s.accounts],
    ['txn_', s.balanceTransactions],
    ['pm_', s.paymentMethods],
  ];
  for (const [prefix, table] of tables) {
    if (id.startsWith(prefix)) return table[id];
  }
  return undefined;
}

/** Fields computed on output for each object type; `expandable` ones appear only when asked for. */
function virtualFields(core: PaymentsCore, item: Renderable): { always: Record<string, () => unknown>; expandable: Record<string, (expand: string[]) => unknown> } {
  if (item.object === 'transfer') {
    const reversals = newestFirst(core.state.transferReversals, (r) => r.transfer === item.id);
    return { always: { reversals: () => embeddedList(core, reversals, `/v1/transfers/${item.id}/reversals`) }, expandable: {} };
  }
  if (item.object === 'charge') {
    const refunds = newestFirst(core.state.refunds, (r) => r.charge === item.id);
    return { always: {}, expandable: { refunds: (expand) => embeddedList(core, refunds, `/v1/charges/${item.id}/refunds`, expand) } };
  }
  if (item.object === 'checkout.session') {
    const lineItems = core.state.sessionLineItems[item.id] ?? [];
    return {
      always: {},
      expandable: {
        line_items: () => ({ object: 'list', data: lineItems.slice(0, 10), has_more: lineItems.length > 10, url: `/v1/checkout/sessions/${item.id}/line_items` }),
      },
    };
  }
  return { always: {}, expandable: {} };
}

const MAX_EXPAND_DEPTH = 4;

/** A response body for one stored object, with `expand` paths such as "payment_intent.latest_charge". */
export function render(core: PaymentsCore, item: Renderable, expand: string[] = [], depth = 0): Record<string, unknown> {
  const out = structuredClone(item) as unknown as Record<string, unknown>;
  const virtual = virtualFields(core, item);
  for (const [field, build] of Object.entries(virtual.always)) out[field] = build();
  const byField = new Map<string, string[]>();
  for (const path of expand) {
    const [field, ...rest] = path.split('.');
    const rests = byField.get(field) ?? [];
    if (rest.length > 0) rests.push(rest.join('.'));
    byField.set(field, rests);
  }
  if (byField.size > 0 && depth >= MAX_EXPAND_DEPTH) throw invalidRequest('You cannot expand more than 4 levels of a property.', { param: 'expand' });
  for (const [field, rests] of byField) {
    const buildList = virtual.expandable[field];
    if (buildList) {
      out[field] = buildList(rests);
      continue;
    }
    const value = out[field];
    if (value === null) continue;
    const target = typeof value === 'string' ? lookupById(core, value) : undefined;
    if (!target) throw invalidRequest(`This property cannot be expanded (${field}).`, { param: 'expand' });
    out[field] = render(core, target, rests, depth + 1);
  }
  return out;
}
