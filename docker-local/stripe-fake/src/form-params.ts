/**
 * Parser for the form encoding the Stripe SDK sends: `a[b][0][c]=1&expand[]=x`.
 * Arrays arrive as maps with numeric keys ("0", "1", …); `[]` appends the next
 * index. Callers that expect a list turn such a map into an array with `asList`,
 * so the parser never has to guess whether `metadata[0]` is a list or a key.
 */

export type Param = string | ParamMap;
export interface ParamMap {
  [key: string]: Param;
}

export class FormParamsError extends Error {
  constructor(
    message: string,
    readonly param: string | null,
  ) {
    super(message);
    this.name = 'FormParamsError';
  }
}

/** Deep enough for every Stripe parameter we accept; stops hostile nesting. */
const MAX_DEPTH = 8;
const MAX_PAIRS = 1000;
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

function newMap(): ParamMap {
  return Object.create(null) as ParamMap;
}

function decode(component: string, raw: string): string {
  try {
    return decodeURIComponent(component.replace(/\+/g, ' '));
  } catch {
    throw new FormParamsError(`Invalid URL encoding in "${raw}".`, null);
  }
}

/** Splits `line_items[0][quantity]` into ["line_items", "0", "quantity"]. */
export function splitKey(key: string): string[] {
  const open = key.indexOf('[');
  if (open === -1) return [key];
  const segments = [key.slice(0, open)];
  let rest = key.slice(open);
  while (rest.length > 0) {
    const match = /^\[([^[\]]*)\]/.exec(rest);
    if (!match) throw new FormParamsError(`Invalid parameter name: ${key}`, key);
    segments.push(match[1] ?? '');
    rest = rest.slice(match[0].length);
  }
  return segments;
}

export function parseFormParams(body: string): ParamMap {
  const root = newMap();
  if (body.trim() === '') return root;
  const pairs = body.split('&').filter((pair) => pair !== '');
  if (pairs.length > MAX_PAIRS) throw new FormParamsError('Too many parameters.', null);

  for (const pair of pairs) {
    const eq = pair.indexOf('=');
    const rawKey = eq === -1 ? pair : pair.slice(0, eq);
    const rawValue = eq === -1 ? '' : pair.slice(eq + 1);
    const key = decode(rawKey, pair);
    const value = decode(rawValue, pair);
    const segments = splitKey(key);
    if (segments[0] === '') throw new FormParamsError(`Invalid parameter name: ${key}`, key);
    if (segments.length > MAX_DEPTH) throw new FormParamsError(`Parameter nested too deeply: ${key}`, key);

    let container = root;
    for (let i = 0; i < segments.length; i += 1) {
      let segment = segments[i] ?? '';
      if (segment === '') segment = String(Object.keys(container).length);
      if (FORBIDDEN_KEYS.has(segment)) throw new FormParamsError(`Invalid parameter name: ${key}`, key);
      const last = i === segments.length - 1;
      const existing = container[segment];
      if (last) {
        if (existing !== undefined && typeof existing !== 'string') {
          throw new FormParamsError(`Invalid value for ${key}: expected a hash, got a string.`, key);
        }
        container[segment] = value;
      } else {
        if (typeof existing === 'string') {
          throw new FormParamsError(`Invalid value for ${key}: ${segments.slice(0, i + 1).join('.')} is a string.`, key);
        }
        const next = existing ?? newMap();
        container[segment] = next;
        container = next;
      }
    }
  }
  return root;
}

/**
 * Turns `{ "1": b, "0": a }` into `[a, b]`. Returns null when the map has a
 * non-numeric key (so the caller can report the parameter as invalid).
 */
export function asList(value: ParamMap): Param[] | null {
  const keys = Object.keys(value);
  if (!keys.every((k) => /^(0|[1-9][0-9]{0,5})$/.test(k))) return null;
  return keys
    .map(Number)
    .sort((a, b) => a - b)
    .map((index) => value[String(index)] as Param);
}

/** Stable text of a parsed body, for comparing a retried request with the first. */
export function canonicalParams(params: ParamMap): string {
  const sortKeys = (value: Param): unknown => {
    if (typeof value === 'string') return value;
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) out[key] = sortKeys(value[key] as Param);
    return out;
  };
  return JSON.stringify(sortKeys(params));
}

/** Joins segments back into Stripe's bracketed parameter name for error messages. */
export function paramName(path: readonly string[]): string {
  const [head, ...rest] = path;
  return (head ?? '') + rest.map((segment) => `[${segment}]`).join('');
}
