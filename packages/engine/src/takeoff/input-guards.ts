/**
 * Guards for data that may arrive malformed (a half-filled form, an old stored record): a
 * list that is not a list, a value that cannot even be printed. Internal to the engine's
 * takeoff, labour and constant-voltage modules; not part of the public API.
 */
import { finding, type Finding } from '../findings';

/** A list from the input, or an empty one with a finding when it is not a list. */
export function listOf<T>(value: readonly T[] | undefined, what: string, findings: Finding[]): readonly T[] {
  if (value === undefined) return [];
  if (Array.isArray(value)) return value;
  findings.push(finding('input-not-a-list', 'error', `The ${what} must be a list.`, { subject: what }));
  return [];
}

/** Any value as short text for a message, without throwing (objects without a prototype included). */
export function shown(value: unknown): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean' || value === null || value === undefined) return String(value);
  try {
    return JSON.stringify(value) ?? typeof value;
  } catch {
    return typeof value;
  }
}
