import qs from 'qs';
import { invalidParam, missingParam, unknownParam } from './api-error';

/**
 * Reading the SDK's request parameters. The SDK sends POST bodies (and GET query strings) as
 * application/x-www-form-urlencoded with bracket notation: `line_items[0][quantity]=1`,
 * `metadata[quote]=Q-1`, `expand[0]=payment_intent`; an empty value (`key=`) means "unset".
 */
export type Params = qs.ParsedQs;
type Value = Params[string];

export function parseParams(raw: string): Params {
  return qs.parse(raw, { depth: 8, arrayLimit: 100, parameterLimit: 2000, allowPrototypes: false });
}

export function rejectUnknown(params: Params, allowed: readonly string[], prefix = ''): void {
  for (const key of Object.keys(params)) {
    if (!allowed.includes(key)) throw unknownParam(prefix ? `${prefix}[${key}]` : key);
  }
}

export function optString(params: Params, key: string, path = key): string | undefined {
  const v = params[key];
  if (v === undefined || v === '') return undefined;
  if (typeof v !== 'string') throw invalidParam(path, `Invalid string: ${path} must be a string.`);
  return v;
}

export function reqString(params: Params, key: string, path = key): string {
  const v = optString(params, key, path);
  if (v === undefined) throw missingParam(path);
  return v;
}

export function optInt(
  params: Params,
  key: string,
  path = key,
  min = Number.MIN_SAFE_INTEGER,
  max = Number.MAX_SAFE_INTEGER,
): number | undefined {
  const v = optString(params, key, path);
  if (v === undefined) return undefined;
  if (!/^-?\d+$/.test(v)) throw invalidParam(path, `Invalid integer: ${v}`, 'parameter_invalid_integer');
  const n = Number(v);
  if (!Number.isSafeInteger(n) || n < min || n > max) {
    throw invalidParam(path, `Invalid integer: ${path} must be between ${min} and ${max}.`, 'parameter_invalid_integer');
  }
  return n;
}

export function optObject(params: Params, key: string, path = key): Params | undefined {
  const v = params[key];
  if (v === undefined || v === '') return undefined;
  if (typeof v !== 'object' || Array.isArray(v)) throw invalidParam(path, `Invalid object: ${path} must be a hash.`);
  return v;
}

/** A list of hashes; qs gives an array, or an object with numeric keys past its array limit. */
export function optList(params: Params, key: string, path = key): Params[] | undefined {
  const v: Value = params[key];
  if (v === undefined || v === '') return undefined;
  const items: unknown[] = Array.isArray(v)
    ? v
    : typeof v === 'object' && Object.keys(v).every((k) => /^\d+$/.test(k))
      ? Object.keys(v)
          .sort((a, b) => Number(a) - Number(b))
          .map((k) => v[k])
      : [v];
  return items.map((item, i) => {
    if (typeof item !== 'object' || item === null || Array.isArray(item)) {
      throw invalidParam(`${path}[${i}]`, `Invalid array: ${path} must be a list of hashes.`);
    }
    return item as Params;
  });
}

/** A list of strings (`expand[0]=a&expand[1]=b`, or `expand[]=a`). */
export function stringList(params: Params, key: string): string[] {
  const v = params[key];
  if (v === undefined || v === '') return [];
  const list = Array.isArray(v) ? v : typeof v === 'object' ? Object.values(v) : [v];
  return list.map((item, i) => {
    if (typeof item !== 'string') throw invalidParam(`${key}[${i}]`, `Invalid array: ${key} must be a list of strings.`);
    return item;
  });
}

/** Metadata: up to 50 keys, key up to 40 characters, value up to 500 (provider limits, from memory). */
export function metadata(params: Params, key = 'metadata', path = key): Record<string, string> {
  const obj = optObject(params, key, path);
  const out: Record<string, string> = {};
  if (!obj) return out;
  const keys = Object.keys(obj);
  if (keys.length > 50) throw invalidParam(path, 'Metadata can have at most 50 keys.');
  for (const k of keys) {
    const v = obj[k];
    if (v === '') continue;
    if (typeof v !== 'string') throw invalidParam(`${path}[${k}]`, `Invalid string: metadata values must be strings.`);
    if (k.length > 40) throw invalidParam(`${path}[${k}]`, 'Metadata keys can be at most 40 characters long.');
    if (v.length > 500) throw invalidParam(`${path}[${k}]`, 'Metadata values can be at most 500 characters long.');
    out[k] = v;
  }
  return out;
}

/** A stable text of the parameters, to compare two requests sent with one idempotency key. */
export function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    const obj = value as Record<string, unknown>;
    return `{${Object.keys(obj)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical(obj[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}
