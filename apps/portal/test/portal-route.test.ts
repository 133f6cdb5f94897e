import { describe, expect, it } from 'vitest';
import { matchPortalRoute } from '../src/app/portal-route';

// The paths are the ones the api writes into e-mails and hands the card payment service
// (portalQuotePath in @gloaming/contracts: `/portal/q/<token>`; the deposit return URL adds
// `/deposit/return?session_id=<id>`).
describe('matchPortalRoute', () => {
  it('opens the quote for /portal/q/<token>, with or without a trailing slash', () => {
    expect(matchPortalRoute('/portal/q/tok_abc-123', '')).toEqual({ kind: 'quote', token: 'tok_abc-123' });
    expect(matchPortalRoute('/portal/q/tok_abc-123/', '?utm=x')).toEqual({ kind: 'quote', token: 'tok_abc-123' });
  });

  it('decodes a %-escaped token the way the link was encoded', () => {
    expect(matchPortalRoute('/portal/q/a%2Bb', '')).toEqual({ kind: 'quote', token: 'a+b' });
  });

  it('reads the checkout session from the deposit return address', () => {
    expect(matchPortalRoute('/portal/q/tok1/deposit/return', '?session_id=cs_test_42')).toEqual({
      kind: 'deposit-return',
      token: 'tok1',
      sessionId: 'cs_test_42',
    });
    expect(matchPortalRoute('/portal/q/tok1/deposit/return', '')).toEqual({ kind: 'deposit-return', token: 'tok1', sessionId: null });
  });

  it('shows the landing page for the portal root and any other path', () => {
    for (const path of ['/portal', '/portal/', '/portal/q', '/portal/q/', '/portal/q/a/b', '/portal/elsewhere', '/portalx/q/a', '/'])
      expect(matchPortalRoute(path, '')).toEqual({ kind: 'landing' });
  });

  it('treats a malformed escape as no link rather than throwing', () => {
    expect(matchPortalRoute('/portal/q/%E0%A4%A', '')).toEqual({ kind: 'landing' });
  });
});
