import type { RequestHandler } from 'express';
import express from 'express';

/** A decoded form value: the provider's API nests with brackets (`a[b][0][c]=…`, `expand[]=…`). */
export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

// Keys that would reach Object.prototype if used as plain property names.
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);
const MAX_DEPTH = 8;

/**
 * Parses `application/x-www-form-urlencoded` text with bracket notation into nested objects and
 * arrays, as the SDK writes it (`line_items[0][price_data][unit_amount]=2500`, `metadata[order]=7`,
 * `expand[0]=payment_intent`; `expand[]=…` appends). Objects whose keys are all indexes become arrays.
 */
export function parseForm(text: string): FormObject {
  const root: FormObject = {};
  if (!text) return root;
  for (const pair of text.split('&')) {
    if (!pair) continue;
    const equals = pair.indexOf('=');
    const rawKey = equals < 0 ? pair : pair.slice(0, equals);
    const rawValue = equals < 0 ? '' : pair.slice(equals + 1);
    const path = keyPath(decode(rawKey));
    if (!path) continue;
    assign(root, path, decode(rawValue));
  }
  return arraysFromIndexes(root) as FormObject;
}

/** Parses a form body of any urlencoded request into `req.body` (a `FormObject`; `{}` when empty). */
export function formBody(): RequestHandler[] {
  return [
    express.text({ type: 'application/x-www-form-urlencoded', limit: '100kb' }),
    (req, _res, next) => {
      req.body = typeof req.body === 'string' ? parseForm(req.body) : isFormObject(req.body) ? req.body : {};
      next();
    },
  ];
}

/** The query string parser for `app.set('query parser', …)`: the same bracket notation as bodies. */
export function parseQuery(query: string): FormObject {
  return parseForm(query);
}

export function isFormObject(value: unknown): value is FormObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function decode(text: string): string {
  try {
    return decodeURIComponent(text.replace(/\+/g, ' '));
  } catch {
    return text;
  }
}

/** `a[b][0][]` → ['a', 'b', '0', ''] (an empty segment means "append"); null when malformed or too deep. */
function keyPath(key: string): string[] | null {
  const open = key.indexOf('[');
  if (open < 0) return key ? [key] : null;
  const path = [key.slice(0, open)];
  const rest = key.slice(open);
  const segment = /\[([^[\]]*)\]/y;
  let match: RegExpExecArray | null;
  let at = 0;
  while (at < rest.length && (match = segment.exec(rest)) !== null) {
    path.push(match[1] ?? '');
    at = segment.lastIndex;
  }
  if (at !== rest.length || !path[0] || path.length > MAX_DEPTH) return null;
  if (path.some((part) => FORBIDDEN_KEYS.has(part))) return null;
  return path;
}

function assign(root: FormObject, path: readonly string[], value: string): void {
  let node: FormObject = root;
  for (let index = 0; index < path.length; index++) {
    let key = path[index] as string;
    if (key === '') key = String(Object.keys(node).length);
    if (index === path.length - 1) {
      node[key] = value;
      return;
    }
    const next = node[key];
    if (isFormObject(next)) {
      node = next;
    } else {
      const child: FormObject = {};
      node[key] = child;
      node = child;
    }
  }
}

function arraysFromIndexes(value: FormValue): FormValue {
  if (!isFormObject(value)) return value;
  const keys = Object.keys(value);
  for (const key of keys) value[key] = arraysFromIndexes(value[key] as FormValue);
  const isList = keys.length > 0 && keys.every((key) => /^(0|[1-9]\d{0,3})$/.test(key));
  if (!isList) return value;
  return keys
    .map(Number)
    .sort((a, b) => a - b)
    .map((index) => value[String(index)] as FormValue);
}
