import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { estimateQuoteInput, type EstimateContent } from '@gloaming/contracts';
import { computeQuoteTotals } from '@gloaming/engine';
import { newLine } from '../../src/features/quotes/grid/cell-codec';
import { readAdjustment, startingAdjustment, withAdjustment } from '../../src/features/quotes/grid/discount-deposit';
import { TotalsPanel } from '../../src/features/quotes/components/totals-panel';
import { useEstimateEditor } from '../../src/features/quotes/hooks/use-estimate-editor';

afterEach(cleanup);

const settings = { currency: 'GBP', locale: 'en-GB', defaultVatRateBp: 2000, markupPercentBp: 3500 };
// one line: 4 x £100.00 at 20 % VAT (UK standard rate, gov.uk)
const start: EstimateContent = {
  sections: [
    {
      id: 's1',
      name: 'Front garden',
      lines: [{ ...newLine(settings, 'l1'), quantityMilli: 4000, unitPriceMinor: 10_000, vatRateBp: 2000 }],
    },
  ],
  discount: null,
  deposit: null,
  introduction: '',
};

function Editor() {
  const editor = useEstimateEditor(start);
  const totals = computeQuoteTotals(estimateQuoteInput(editor.content, { vatRounding: 'line-nearest-1p' }));
  return (
    <>
      <button type="button" onClick={editor.undo} disabled={!editor.canUndo}>
        Undo
      </button>
      <button type="button" onClick={editor.redo} disabled={!editor.canRedo}>
        Redo
      </button>
      <TotalsPanel
        totals={totals}
        currency="GBP"
        locale="en-GB"
        adjustments={{ content: editor.content, onChange: editor.change, firmDepositBp: 3000, readOnly: false }}
      />
    </>
  );
}

const total = (name: string) => document.querySelector(`[data-total="${name}"]`)?.textContent;

describe('discount and deposit in the totals panel', () => {
  it('reads percentages and amounts (sums too) and refuses what cannot be a discount', () => {
    expect(readAdjustment('percent', '12.5')).toEqual({ ok: true, value: { kind: 'percent', bp: 1250 } });
    expect(readAdjustment('percent', '30/2 %')).toEqual({ ok: true, value: { kind: 'percent', bp: 1500 } });
    expect(readAdjustment('fixed', '£1,250.50')).toEqual({ ok: true, value: { kind: 'fixed', amountMinor: 125_050 } });
    expect(readAdjustment('percent', '120')).toMatchObject({ ok: false });
    expect(readAdjustment('fixed', 'lots')).toMatchObject({ ok: false });
    expect(readAdjustment('none', 'anything')).toEqual({ ok: true, value: null });
    expect(startingAdjustment('deposit', 'percent', 3000)).toEqual({ kind: 'percent', bp: 3000 });
    expect(startingAdjustment('discount', 'percent', 3000)).toEqual({ kind: 'percent', bp: 0 });
    // the same value is no change (no undo step)
    const d = withAdjustment(start, 'discount', { kind: 'percent', bp: 1000 });
    expect(withAdjustment(d, 'discount', { kind: 'percent', bp: 1000 })).toBe(d);
  });

  it('sets a percentage discount and a deposit by keyboard, totals follow, and undo takes each back', async () => {
    const user = userEvent.setup();
    render(<Editor />);
    expect(total('total')).toBe('£480.00'); // 400.00 + 20 % VAT
    expect(total('deposit')).toBeUndefined();

    await user.selectOptions(screen.getByLabelText('Discount'), 'percent');
    const pct = screen.getByLabelText('Discount percentage');
    await user.clear(pct);
    await user.type(pct, '10{Enter}');
    // 10 % off 400.00 = 40.00; VAT 20 % of 360.00 = 72.00; total 432.00
    expect(total('discount')).toBe('−£40.00');
    expect(total('total')).toBe('£432.00');

    // a new deposit as a percentage starts at the firm's default (30 %)
    await user.selectOptions(screen.getByLabelText('Deposit'), 'percent');
    expect((screen.getByLabelText('Deposit percentage') as HTMLInputElement).value).toBe('30');
    expect(total('deposit')).toBe('£129.60'); // 30 % of 432.00
    await user.selectOptions(screen.getByLabelText('Deposit'), 'fixed');
    const fixed = screen.getByLabelText('Deposit amount in GBP');
    await user.clear(fixed);
    await user.type(fixed, '100+50');
    await user.tab(); // leaving the field settles it
    expect(total('deposit')).toBe('£150.00');

    await user.click(screen.getByRole('button', { name: 'Undo' })); // fixed 0 -> 150 undone
    expect(total('deposit')).toBe('£0.00');
    await user.click(screen.getByRole('button', { name: 'Undo' })); // back to the 30 % deposit
    expect(total('deposit')).toBe('£129.60');
    await user.click(screen.getByRole('button', { name: 'Undo' })); // no deposit
    expect(total('deposit')).toBeUndefined();
    expect(total('total')).toBe('£432.00');
    await user.click(screen.getByRole('button', { name: 'Undo' })); // the 10 %
    await user.click(screen.getByRole('button', { name: 'Undo' })); // choosing a percentage
    expect(total('total')).toBe('£480.00');
    expect((screen.getByLabelText('Discount') as HTMLSelectElement).value).toBe('none');
    await user.click(screen.getByRole('button', { name: 'Redo' }));
    await user.click(screen.getByRole('button', { name: 'Redo' }));
    expect(total('total')).toBe('£432.00');
  });

  it('keeps a bad amount in the field with the reason, and Escape puts the value back', async () => {
    const user = userEvent.setup();
    render(<Editor />);
    await user.selectOptions(screen.getByLabelText('Discount'), 'fixed');
    const amount = screen.getByLabelText('Discount amount in GBP');
    await user.clear(amount);
    await user.type(amount, 'twenty{Enter}');
    expect(screen.getByRole('alert').textContent).toMatch(/^Use numbers with \+ - \* \//); // the grid's own reader says why
    expect(amount.getAttribute('aria-invalid')).toBe('true');
    expect((amount as HTMLInputElement).value).toBe('twenty');
    await user.keyboard('{Escape}');
    expect((amount as HTMLInputElement).value).toBe('0.00');
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
