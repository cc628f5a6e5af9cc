import { z } from 'zod';
import { invalidRequest, noSuch } from './errors';
import { expandParam, listParams, parseParams } from './params';
import type { PaymentsCore } from './core';
import { paginate, newestFirst } from './render';
import type { Route } from './routes-types';
import type { StripeEvent } from './types';

const eventListInputSchema = z.strictObject({
  ...listParams,
  type: z.string().optional(),
  types: z.array(z.string()).optional(),
});
const retrieveInputSchema = z.strictObject({ expand: expandParam });

/** `charge.*` matches every charge event, as the hosted filter does. */
export function eventTypeMatches(pattern: string, type: string): boolean {
  if (pattern.endsWith('.*')) return type.startsWith(pattern.slice(0, -1));
  return pattern === type;
}

function listEvents(core: PaymentsCore, params: Parameters<Route['handle']>[1]['params']): unknown {
  const input = parseParams(eventListInputSchema, params);
  if (input.type !== undefined && input.types !== undefined) {
    throw invalidRequest('You may only specify one of these parameters: type, types.', { param: 'types' });
  }
  const patterns = input.types ?? (input.type === undefined ? undefined : [input.type]);
  const items = newestFirst(core.state.events, (event: StripeEvent) => patterns === undefined || patterns.some((p) => eventTypeMatches(p, event.type)));
  const { page, has_more } = paginate(items, input);
  return { object: 'list', data: page, has_more, url: '/v1/events' };
}

export const eventRoutes: Route[] = [
  { method: 'GET', pattern: '/v1/events', handle: (core, req) => listEvents(core, req.params) },
  {
    method: 'GET',
    pattern: '/v1/events/:id',
    handle: (core, req) => {
      parseParams(retrieveInputSchema, req.params);
      const event = core.state.events[req.path.id];
      if (!event) throw noSuch('event', req.path.id);
      return event;
    },
  },
];
