import { z } from 'zod';
import { invalidRequest } from './errors';
import type { FormObject, FormValue } from './form-encoding';

// Request parameters arrive as strings (form encoding has no types); these helpers convert them the way the
// hosted API does and make zod's issues read like its errors ("Missing required param: amount.").

type IssueParams = { code?: string };

function custom(ctx: z.RefinementCtx, message: string, code: string): typeof z.NEVER {
  ctx.addIssue({ code: 'custom', message, params: { code } satisfies IssueParams });
  return z.NEVER;
}

/** An integer sent as a decimal string. */
export const intParam = z.string().transform((text, ctx) => {
  if (!/^-?\d+$/.test(text)) return custom(ctx, `Invalid integer: ${text}`, 'parameter_invalid_integer');
  return Number(text);
});

export const boolParam = z.string().transform((text, ctx) => {
  if (text === 'true') return true;
  if (text === 'false') return false;
  return custom(ctx, `Invalid boolean: ${text}`, 'parameter_invalid_boolean');
});

export function enumParam<const T extends readonly [string, ...string[]]>(values: T) {
  return z.string().transform((text, ctx) => {
    if ((values as readonly string[]).includes(text)) return text as T[number];
    return custom(ctx, `Invalid value: must be one of ${values.join(', ')}`, 'parameter_invalid');
  });
}

export function stringParam(max = 5000) {
  return z.string().max(max, { message: `must be at most ${max} characters` });
}

/**
 * Metadata limits from the public reference (from memory): 50 keys, keys up to 40 characters, values up
 * to 500. An empty value means "delete this key" on update.
 */
export const metadataParam = z
  .preprocess(
    (value) => (Array.isArray(value) ? Object.fromEntries(value.map((item, index) => [String(index), item])) : value),
    z.record(z.string().max(40, { message: 'keys must be at most 40 characters' }), z.string().max(500, { message: 'values must be at most 500 characters' })),
  )
  .refine((record) => Object.keys(record).length <= 50, { message: 'at most 50 keys' });

export const expandParam = z.array(z.string()).optional();

export const listParams = {
  limit: intParam.optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
  expand: expandParam,
};

/** Bracketed name of a parameter path: ['line_items', 0, 'quantity'] → "line_items[0][quantity]". */
export function bracketPath(path: ReadonlyArray<PropertyKey>): string {
  return path.map((segment, index) => (index === 0 ? String(segment) : `[${String(segment)}]`)).join('');
}

/**
 * Empty strings mean "unset" on the wire; outside metadata (where they delete a key) they are dropped so
 * optional parameters behave as absent.
 */
function dropEmptyStrings(value: FormValue, insideMetadata: boolean): FormValue | undefined {
  if (typeof value === 'string') return value === '' && !insideMetadata ? undefined : value;
  if (Array.isArray(value)) return value.map((item) => dropEmptyStrings(item, insideMetadata)).filter((item): item is FormValue => item !== undefined);
  const out: FormObject = {};
  for (const [key, item] of Object.entries(value)) {
    const cleaned = dropEmptyStrings(item, insideMetadata || key === 'metadata');
    if (cleaned !== undefined) out[key] = cleaned;
  }
  return out;
}

function valueAt(root: unknown, path: ReadonlyArray<PropertyKey>): unknown {
  let node = root;
  for (const segment of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PropertyKey, unknown>)[segment];
  }
  return node;
}

/** Validates raw parameters with a zod schema; the first problem becomes the hosted API's 400. */
export function parseParams<S extends z.ZodType>(schema: S, raw: FormObject): z.output<S> {
  const cleaned = dropEmptyStrings(raw, false) as FormObject;
  const result = schema.safeParse(cleaned);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const param = bracketPath(issue.path);
  if (issue.code === 'unrecognized_keys') {
    const name = param === '' ? issue.keys[0] : `${param}[${issue.keys[0]}]`;
    throw invalidRequest(`Received unknown parameter: ${name}`, { code: 'parameter_unknown', param: name });
  }
  if (valueAt(cleaned, issue.path) === undefined) {
    throw invalidRequest(`Missing required param: ${param}.`, { code: 'parameter_missing', param });
  }
  const code = issue.code === 'custom' ? ((issue.params as IssueParams | undefined)?.code ?? 'parameter_invalid') : 'parameter_invalid';
  const message = code === 'parameter_invalid' ? `Invalid ${param}: ${issue.message}` : issue.message;
  throw invalidRequest(message, { code, param });
}
