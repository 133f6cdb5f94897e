/**
 * The portal's three pages, read from the address once at start-up. The api serves index.html
 * for every path under /portal/, and the portal never navigates within itself (its links are
 * ordinary page loads), so a router library would only add weight to a phone's first load.
 */
export type PortalRoute =
  | { kind: 'landing' }
  | { kind: 'quote'; token: string }
  | { kind: 'deposit-return'; token: string; sessionId: string | null };

export const PORTAL_BASE = '/portal';

const QUOTE_PATH = /^\/q\/([^/]+)\/?$/;
const DEPOSIT_RETURN_PATH = /^\/q\/([^/]+)\/deposit\/return\/?$/;

function decodeSegment(segment: string): string | null {
  try {
    return decodeURIComponent(segment);
  } catch {
    return null; // a malformed %-escape: not a link we made
  }
}

/** `/portal/q/<token>` opens the quote, `…/deposit/return?session_id=…` is the card payment page's way back; anything else is the landing page. */
export function matchPortalRoute(pathname: string, search: string): PortalRoute {
  if (pathname !== PORTAL_BASE && !pathname.startsWith(`${PORTAL_BASE}/`)) return { kind: 'landing' };
  const path = pathname.slice(PORTAL_BASE.length);
  const quote = QUOTE_PATH.exec(path);
  const quoteToken = quote?.[1] ? decodeSegment(quote[1]) : null;
  if (quoteToken) return { kind: 'quote', token: quoteToken };
  const back = DEPOSIT_RETURN_PATH.exec(path);
  const backToken = back?.[1] ? decodeSegment(back[1]) : null;
  if (backToken) return { kind: 'deposit-return', token: backToken, sessionId: new URLSearchParams(search).get('session_id') };
  return { kind: 'landing' };
}
