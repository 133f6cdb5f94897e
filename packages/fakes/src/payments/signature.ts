import { createHmac } from 'node:crypto';

/**
 * The provider's webhook signature scheme: `t=<unix seconds>,v1=<hex HMAC-SHA256>` where the
 * HMAC key is the whole endpoint secret (`whsec_...`) and the signed text is `<t>.<raw body>`.
 * Receivers verify it over the exact bytes they were sent, so the body must never be re-serialised.
 */
export function signPayload(payload: string, secret: string, timestamp: number): string {
  return createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
}

/** The `Stripe-Signature` header value for `payload` signed at `timestamp` (unix seconds). */
export function signatureHeader(payload: string, secret: string, timestamp: number): string {
  return `t=${timestamp},v1=${signPayload(payload, secret, timestamp)}`;
}
