/**
 * Responses that carry a stored JSON document (a 300-line estimate is 120 KB) pass its text
 * through as stored instead of parsing it and serialising it again. The text is typed with
 * what it holds, so a response built from pieces is checked against its contract as a whole:
 *
 *   const revision = withJsonText<QuoteRevisionView, 'content'>(rest, 'content', storedJsonText(row.contentJson));
 *   sendJsonText(res, withJsonText<QuoteDetailResponse, 'revision'>({ quote, revisions }, 'revision', revision));
 *
 * Only text that a contract validated when it was written may be called stored JSON text.
 */
import type { Response } from 'express';

declare const holds: unique symbol;
/** JSON text of a value of type T. */
export type JsonText<T> = string & { readonly [holds]: T };

/** A document stored as JSON text after its contract validated it on the way in. */
export function storedJsonText<T>(text: string): JsonText<T> {
  return text as JsonText<T>;
}

export function toJsonText<T>(value: T): JsonText<T> {
  return JSON.stringify(value) as JsonText<T>;
}

export function arrayJsonText<T>(items: readonly JsonText<T>[]): JsonText<T[]> {
  return `[${items.join(',')}]` as JsonText<T[]>;
}

/** The JSON of `rest` with `key` set to `text` (added as the last member). */
export function withJsonText<T extends object, K extends keyof T & string>(
  rest: Omit<T, K>,
  key: K,
  text: JsonText<T[K]>,
): JsonText<T> {
  const head = JSON.stringify(rest);
  const member = `${JSON.stringify(key)}:${text}`;
  return (head === '{}' ? `{${member}}` : `${head.slice(0, -1)},${member}}`) as JsonText<T>;
}

/** Send JSON text as `res.json` would send the value it holds. */
export function sendJsonText<T>(res: Response, text: JsonText<T>): void {
  res.type('application/json').send(text);
}
