/**
 * Pieces the quote journeys share: an estimate line with every field the contract asks for,
 * the local mail catcher read until a matching message arrives, and a customer with a quote
 * made through the api from inside a signed-in page (its cookie and origin).
 */
import type { Page } from 'playwright-core';
import type { EstimateContent, EstimateLine } from '@gloaming/contracts';
import type { CaughtMessage } from '@gloaming/fakes';

/** A fixed-price line at 20 % VAT, selected, with `extra` over the defaults. */
export function estimateLine(
  id: string,
  description: string,
  quantityMilli: number,
  unitPriceMinor: number,
  extra: Partial<EstimateLine> = {},
): EstimateLine {
  return {
    id,
    productId: null,
    description,
    quantityMilli,
    unit: 'each',
    unitCostMinor: 1111,
    pricingMode: 'fixed',
    pricingBp: 0,
    unitPriceMinor,
    vatRateBp: 2000,
    discount: null,
    optional: false,
    alternativeGroup: null,
    selected: true,
    note: '',
    circuitId: null,
    overridden: false,
    ...extra,
  };
}

/** A message as the catcher's web inbox lists it. */
export type CaughtMail = CaughtMessage;

/** The first message in the catcher that `match` accepts, waiting for it up to `timeoutMs`. */
export async function waitForMail(inboxUrl: string, match: (m: CaughtMail) => boolean, timeoutMs = 20_000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const { messages } = (await (await fetch(`${inboxUrl}/messages`)).json()) as { messages: CaughtMail[] };
    const found = messages.find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no matching e-mail in ${timeoutMs} ms; have: ${messages.map((m) => m.subject).join(' | ')}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export interface QuoteThroughApi {
  customer: { name: string; email: string };
  site: { label: string; addressLines: string; postcode: string };
  title: string;
  content: EstimateContent;
  /** Also send revision 1 through the api (otherwise it stays a draft). */
  send?: boolean;
}

/** From a page signed in as an estimator: the customer, the quote and its estimate; the quote's id. */
export async function createQuoteThroughApi(page: Page, spec: QuoteThroughApi): Promise<string> {
  return page.evaluate(async ({ customer, site, title, content, send }) => {
    const call = (path: string, body: unknown, method = 'POST') =>
      fetch(path, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }).then(async (r) => {
        if (!r.ok) throw new Error(`${method} ${path}: ${r.status} ${await r.text()}`);
        return r.json();
      });
    const c = await call('/api/customers', { ...customer, sites: [site] });
    const q = await call('/api/quotes', { customerId: c.customer.id, siteId: c.customer.sites[0].id, title });
    const detail = await fetch(`/api/quotes/${q.quote.id}`).then((r) => r.json());
    await call(`/api/quotes/${q.quote.id}/revisions/1`, { version: detail.revision.version, content }, 'PUT');
    if (send) await call(`/api/quotes/${q.quote.id}/revisions/${detail.revision.id}/send`, {});
    return q.quote.id as string;
  }, spec);
}

/** The portal link in a message, for the server at `baseUrl`. */
export function portalLinkIn(text: string, baseUrl: string): string | null {
  return new RegExp(`${baseUrl.replace(/[.:/]/g, '\\$&')}/portal/q/[A-Za-z0-9_-]{43}`).exec(text)?.[0] ?? null;
}
