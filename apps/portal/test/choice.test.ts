import { describe, expect, it } from 'vitest';
import type { PortalLine, PortalQuoteView } from '@gloaming/contracts';
import { choose, localTotals, sameSelection } from '../src/features/quote/choice';

const line = (p: Partial<PortalLine> & Pick<PortalLine, 'id' | 'quantityMilli' | 'unitPriceMinor'>): PortalLine => ({
  description: p.id,
  note: '',
  unit: 'each',
  vatRateBp: 2000,
  discount: null,
  amountMinor: 0,
  kind: 'standard',
  group: null,
  selected: true,
  ...p,
});

// An invented path scheme: 4 path lights at £60.00, an optional uplighter at £90.00 and a choice
// of driver (£80.00 or £120.00). VAT at the UK standard rate of 20 % (gov.uk), per line to the penny.
const view = {
  vatRounding: 'line-nearest-1p',
  discount: null,
  deposit: { kind: 'percent', bp: 2500 },
  sections: [
    {
      id: 's',
      name: 'Path',
      lines: [
        line({ id: 'path', quantityMilli: 4000, unitPriceMinor: 6000 }),
        line({ id: 'uplight', quantityMilli: 1000, unitPriceMinor: 9000, kind: 'optional', selected: false }),
        line({ id: 'plain', quantityMilli: 1000, unitPriceMinor: 8000, kind: 'alternative', group: 'Driver', selected: true }),
        line({ id: 'smart', quantityMilli: 1000, unitPriceMinor: 12000, kind: 'alternative', group: 'Driver', selected: false }),
      ],
    },
  ],
} as unknown as PortalQuoteView;

describe('the homeowner choice in the browser', () => {
  it('adds up the suggested choice: 4 x £60 + £80 = £320 net, VAT £64, total £384, deposit 25 % £96', () => {
    const t = localTotals(view, { uplight: false, plain: true, smart: false });
    expect([t.netMinor, t.vatMinor, t.totalMinor, t.deposit?.depositMinor]).toEqual([32000, 6400, 38400, 9600]);
  });

  it('follows a ticked extra and a swapped driver: £240 + £90 + £120 = £450 net, £540 total, deposit £135', () => {
    let s = choose(view, { uplight: false, plain: true, smart: false }, 'uplight', true);
    s = choose(view, s, 'smart', true);
    expect(s).toEqual({ uplight: true, plain: false, smart: true });
    const t = localTotals(view, s);
    expect([t.netMinor, t.vatMinor, t.totalMinor, t.deposit?.depositMinor]).toEqual([45000, 9000, 54000, 13500]);
  });

  it('never lets a fixed line be left out, and compares choices by value', () => {
    const s = { uplight: false, plain: true, smart: false };
    expect(choose(view, s, 'path', false)).toBe(s);
    expect(sameSelection(s, { smart: false, plain: true, uplight: false })).toBe(true);
    expect(sameSelection(s, { ...s, uplight: true })).toBe(false);
  });
});
