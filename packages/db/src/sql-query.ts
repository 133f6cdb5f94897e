import type { EntityManager } from '@mikro-orm/core';
import { raw, SqlEntityManager, type Knex } from '@mikro-orm/knex';
import { PostgreSqlPlatform } from '@mikro-orm/postgresql';
import type { DatabaseDialect } from './config';

/**
 * The SQL side of an entity manager, for queries worth writing with the query builder
 * (aggregates over the event history). Every Gloaming em is one; anything else is a bug.
 */
export function sqlEm(em: EntityManager): SqlEntityManager {
  if (!(em instanceof SqlEntityManager)) throw new Error('Expected a SQL entity manager.');
  return em;
}

export { raw } from '@mikro-orm/knex';

/**
 * The few places where SQLite and PostgreSQL spell things differently. Everything else
 * (entities, the query builder, plain SQL aggregates) is the same on both.
 */
export function sqlDialect(em: EntityManager): DatabaseDialect {
  return em.getPlatform() instanceof PostgreSqlPlatform ? 'postgresql' : 'sqlite';
}

const JSON_KEY = /^[A-Za-z_][A-Za-z0-9_]*$/;
const SQL_REF = /^[A-Za-z_][A-Za-z0-9_]*(\.[A-Za-z_][A-Za-z0-9_]*)?$/;

function jsonPath(column: string, key: string): void {
  if (!SQL_REF.test(column) || !JSON_KEY.test(key)) throw new Error(`Not a plain column and key: ${column}, ${key}`);
}

/**
 * SQL for a top-level key of a json column, for raw select fragments: SQLite's
 * json_extract (which keeps the json type: numbers come back as numbers), PostgreSQL's
 * jsonb `->>` (text). Use `jsonNumber` where the value is summed or compared as a number.
 */
export function jsonValue(em: EntityManager, column: string, key: string): string {
  jsonPath(column, key);
  return sqlDialect(em) === 'postgresql' ? `(${column}->>'${key}')` : `json_extract(${column}, '$.${key}')`;
}

/** A numeric top-level key of a json column, as a number on both databases. */
export function jsonNumber(em: EntityManager, column: string, key: string): string {
  jsonPath(column, key);
  return sqlDialect(em) === 'postgresql' ? `(${column}->>'${key}')::numeric` : `json_extract(${column}, '$.${key}')`;
}

/**
 * A datetime as a bound parameter of raw SQL compared with a datetime column: SQLite stores
 * MikroORM datetimes as epoch milliseconds, PostgreSQL as timestamptz.
 */
export function dateParam(em: EntityManager, at: Date): number | Date {
  return sqlDialect(em) === 'postgresql' ? at : at.getTime();
}

const SQL_COLUMN = /^[a-z_][a-z0-9_]*$/;

/**
 * A case-insensitive "contains this text" condition on one text column, the typed text taken
 * literally: a % or _ in it is escaped, with the escape character named in the SQL (SQLite's
 * LIKE has none otherwise). LIKE on SQLite (which ignores the case of ASCII letters), ILIKE on
 * PostgreSQL. Put it where the column's entity is in the filter, e.g.
 * `{ $or: [containsIgnoringCase(em, 'title', q), { customer: containsIgnoringCase(em, 'name', q) }] }`.
 * `column` is the SQL column name (snake_case); each call makes a new fragment, use it once.
 */
export function containsIgnoringCase(em: EntityManager, column: string, text: string): Record<string, never[]> {
  if (!SQL_COLUMN.test(column)) throw new Error(`Not a plain column name: ${column}`);
  const op = sqlDialect(em) === 'postgresql' ? 'ilike' : 'like';
  const pattern = `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  return { [raw((alias: string) => `${alias}.${column} ${op} ? escape '\\'`, [pattern])]: [] };
}

/** A boolean read back by raw SQL: SQLite keeps booleans as 0/1, PostgreSQL as booleans. */
export function booleanFromSql(v: unknown): boolean {
  return v === true || v === 1 || v === '1';
}

/**
 * A datetime read back by raw SQL, as a Date: SQLite hands back MikroORM datetimes as stored
 * (epoch milliseconds, or ISO text), PostgreSQL's driver as timestamptz text
 * ("2026-03-02 09:00:00.123+00"). Null for null or unreadable values.
 */
export function dateFromSql(v: unknown): Date | null {
  if (v === null || v === undefined) return null;
  if (v instanceof Date) return Number.isNaN(v.getTime()) ? null : v;
  let d: Date | null = null;
  if (typeof v === 'number') d = new Date(v);
  else if (typeof v === 'string') {
    if (/^\d+$/.test(v)) d = new Date(Number(v));
    else {
      const iso = v.replace(' ', 'T').replace(/([+-]\d\d)(\d\d)?$/, (_, h: string, m?: string) => `${h}:${m ?? '00'}`);
      d = new Date(/(Z|[+-]\d\d:\d\d)$/.test(iso) ? iso : `${iso}Z`);
    }
  }
  return d && !Number.isNaN(d.getTime()) ? d : null;
}

/**
 * Run a knex query built on `sqlEm(em).getKnex()` (or a transaction of it), turning driver
 * errors into the exceptions the entity manager throws, so a busy database is a 503 and a
 * broken constraint a 409 exactly as through the entity manager.
 */
export async function runPlain<T>(em: EntityManager, query: PromiseLike<T>): Promise<T> {
  try {
    return await query;
  } catch (err) {
    throw err instanceof Error ? em.getDriver().convertException(err) : err;
  }
}

/**
 * A json column selected as its JSON text, for responses that pass a stored document through
 * unparsed: SQLite keeps json as text already; PostgreSQL's driver would parse jsonb, so it
 * is cast. `column` is a (table-qualified) SQL column; `as` the name it comes back under.
 */
export function jsonText(em: EntityManager, column: string, as: string): ReturnType<Knex['raw']> {
  if (!SQL_COLUMN.test(as)) throw new Error(`Not a plain column name: ${as}`);
  return sqlEm(em).getKnex().raw(`${jsonTextSql(em, column)} as ${as}`);
}

/** The SQL expression of a json column as its JSON text (jsonText without the name), for use inside a larger expression. */
export function jsonTextSql(em: EntityManager, column: string): string {
  if (!SQL_REF.test(column)) throw new Error(`Not a plain column: ${column}`);
  return sqlDialect(em) === 'postgresql' ? `${column}::text` : column;
}

/** A json column read by raw SQL, as a value: SQLite hands back text, PostgreSQL parsed jsonb. */
export function jsonFromSql(v: unknown): unknown {
  return typeof v === 'string' ? JSON.parse(v) : v;
}
