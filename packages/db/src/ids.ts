import { randomBytes, randomUUID } from 'node:crypto';

/** Primary keys are random UUIDs: unguessable, safe to show in URLs, merge-friendly. */
export function newId(): string {
  return randomUUID();
}

/** A 32-byte random token, base64url: for invite, reset and portal links. Store only its hash. */
export function newSecretToken(): string {
  return randomBytes(32).toString('base64url');
}
