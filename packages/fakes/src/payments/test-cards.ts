/**
 * What the provider's documented test card numbers do (provider testing docs via
 * ../shared/REFERENCES.md). Any other number that passes the Luhn check is refused the way the
 * provider refuses a real card in test mode (from memory).
 */
export type CardOutcome =
  { kind: 'succeed' } | { kind: 'decline'; code: 'card_declined' | 'expired_card'; declineCode?: string; message: string };

export const TEST_CARDS: Readonly<Record<string, { label: string; outcome: CardOutcome }>> = {
  '4242424242424242': { label: 'succeeds', outcome: { kind: 'succeed' } },
  '4000000000000002': {
    label: 'declined',
    outcome: { kind: 'decline', code: 'card_declined', declineCode: 'generic_decline', message: 'Your card was declined.' },
  },
  '4000000000009995': {
    label: 'insufficient funds',
    outcome: {
      kind: 'decline',
      code: 'card_declined',
      declineCode: 'insufficient_funds',
      message: 'Your card has insufficient funds.',
    },
  },
  '4000000000000069': {
    label: 'expired card',
    outcome: { kind: 'decline', code: 'expired_card', declineCode: 'expired_card', message: 'Your card has expired.' },
  },
};

/** Luhn (mod 10) check digit test used by card numbers (ISO/IEC 7812-1). */
export function passesLuhn(digits: string): boolean {
  if (!/^\d+$/.test(digits)) return false;
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

export function outcomeForCard(digits: string): CardOutcome {
  return (
    TEST_CARDS[digits]?.outcome ?? {
      kind: 'decline',
      code: 'card_declined',
      declineCode: 'test_mode_live_card',
      message: 'Your card was declined. This is a test payment page: use one of the test card numbers.',
    }
  );
}

/** Card brand from the leading digits, for the charge's payment method summary. */
export function brandOf(digits: string): string {
  if (digits.startsWith('4')) return 'visa';
  if (/^(5[1-5]|2[2-7])/.test(digits)) return 'mastercard';
  if (/^3[47]/.test(digits)) return 'amex';
  return 'unknown';
}
