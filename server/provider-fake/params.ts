import { z } from 'zod';

import { ProviderError } from './errors';
import type { FormValue } from './form-body';

/**
 * Reads a request's form parameters with a zod schema. The provider answers the first problem only,
 * naming the parameter in bracket notation (`line_items[0][price_data][unit_amount]`) as `param`.
 */
export function readParams<T extends z.ZodType>(schema: T, params: unknown): z.output<T> {
  const parsed = schema.safeParse(params);
  if (parsed.success) return parsed.data;
  // Unknown parameters first, as the provider refuses them before reading values.
  const { issues } = parsed.error;
  const issue = (issues.find((each) => each.code === 'unrecognized_keys') ?? issues[0]) as z.core.$ZodIssue;
  if (issue.code === 'unrecognized_keys') throw ProviderError.unknownParam(bracketPath([...issue.path, issue.keys[0] ?? '']));
  const param = bracketPath(issue.path);
  if (valueAt(params, issue.path) === undefined) throw ProviderError.missingParam(param);
  throw ProviderError.invalidRequest(`Invalid ${param}: ${issue.message}`, param);
}

/** ['line_items', 0, 'quantity'] → `line_items[0][quantity]`. */
export function bracketPath(path: readonly PropertyKey[]): string {
  const [head, ...rest] = path.map(String);
  return `${head ?? ''}${rest.map((part) => `[${part}]`).join('')}`;
}

function valueAt(params: unknown, path: readonly PropertyKey[]): unknown {
  let node: unknown = params;
  for (const key of path) {
    if (typeof node !== 'object' || node === null) return undefined;
    node = (node as Record<PropertyKey, unknown>)[key];
  }
  return node;
}

/** A whole number sent as form text (the SDK writes numbers as decimal strings). */
export function integerParam(min: number, max: number) {
  return z
    .string({ error: 'must be a whole number' })
    .regex(/^-?\d{1,15}$/, { error: 'must be a whole number' })
    .transform(Number)
    .pipe(z.number().min(min, { error: `must be at least ${min}` }).max(max, { error: `must be at most ${max}` }));
}

export function textParam(maxLength: number) {
  return z.string({ error: 'must be text' }).max(maxLength, { error: `must be at most ${maxLength} characters` });
}

export const booleanParam = z.enum(['true', 'false'], { error: 'must be true or false' }).transform((value) => value === 'true');

/** An absolute http(s) URL; `{CHECKOUT_SESSION_ID}` placeholders are allowed as sent. */
export const urlParam = z.string({ error: 'must be a URL' }).refine(isAbsoluteHttpUrl, { error: 'must be an absolute http(s) URL' });

function isAbsoluteHttpUrl(value: string): boolean {
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:';
  } catch {
    return false;
  }
}

// The provider's metadata limits from its public API reference (from memory): 50 keys, keys up to
// 40 characters, values up to 500. An empty string means "no metadata".
const METADATA_KEYS_MAX = 50;
export const metadataParam = z.preprocess(
  (value: unknown) => (value === '' ? {} : value),
  z
    .record(
      z.string().max(40, { error: 'keys must be at most 40 characters' }),
      z.string({ error: 'values must be text' }).max(500, { error: 'values must be at most 500 characters' }),
      { error: 'must be a set of key-value pairs' },
    )
    .refine((entries) => Object.keys(entries).length <= METADATA_KEYS_MAX, { error: `must have at most ${METADATA_KEYS_MAX} keys` }),
);

export type Metadata = Record<string, string>;

/** `expand[]=payment_intent&expand[]=line_items`; a bare `expand=x` is not a list and is refused. */
export const expandParam = z.array(z.string(), { error: 'must be a list (expand[]=…)' }).max(10, { error: 'must list at most 10 fields' });

/** Parameters every endpoint takes and ignores or reads on its own. */
export const commonQuery = z.looseObject({ expand: expandParam.optional() });

export function formText(value: FormValue | undefined): string | undefined {
  return typeof value === 'string' ? value : undefined;
}
