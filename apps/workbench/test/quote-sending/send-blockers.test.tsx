/** The send dialog lists a circuit's unaccepted errors under a link to that circuit. */
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import type { SendPreviewResponse } from '@gloaming/contracts';
import { QuoteSendControls } from '../../src/features/quote-sending/components/quote-send-controls';
import { groupBlockers } from '../../src/features/quote-sending/components/send-blockers';
import { json, stubFetch } from '../fetch-stub';
import { renderWithApp } from '../render';

afterEach(cleanup);

const QUOTE = '0b9f5d8e-1111-4c1e-9d7a-0a0b0c0d0e0f';
const REV = '0b9f5d8e-2222-4c1e-9d7a-0a0b0c0d0e0f';
const CIRCUIT = '0b9f5d8e-3333-4c1e-9d7a-0a0b0c0d0e0f';
const circuitBlocker = (findingCode: string, subject: string, message: string) => ({
  code: 'circuit-error',
  message: `Circuit “Front path: Path string”: ${message}`,
  pointer: `/api/quotes/${QUOTE}/revisions/1/circuits/${CIRCUIT}`,
  circuit: { id: CIRCUIT, name: 'Path string', area: 'Front path', findingCode, subject },
});
const blockers: SendPreviewResponse['blockers'] = [
  { code: 'no-lines', message: 'This quote has no lines yet.' },
  circuitBlocker('driver-current-mismatch', 'driver', 'This driver gives 700 mA but the fittings are set to 350 mA.'),
  circuitBlocker('current-above-rating', 'fitting:1', 'Fitting 1 is driven at 700 mA, above its 350 mA rating.'),
];

describe('send blockers', () => {
  it('groups circuit errors by circuit and keeps the quote’s own blockers apart', () => {
    const g = groupBlockers(blockers);
    expect(g.general.map((b) => b.code)).toEqual(['no-lines']);
    expect(g.circuits).toHaveLength(1);
    expect(g.circuits[0]).toMatchObject({ id: CIRCUIT, title: 'Front path: Path string' });
    expect(g.circuits[0]!.items.map((b) => b.circuit?.findingCode)).toEqual(['driver-current-mismatch', 'current-above-rating']);
  });

  it('shows each error with a link to its circuit and offers no send', async () => {
    stubFetch((r) =>
      r.url.includes('/send-preview')
        ? json(200, {
            to: 'ottilie@brackenbury.example',
            subject: 'Quotation',
            text: 'Dear Ottilie',
            attachmentName: 'Quotation Q-0001 rev 1.pdf',
            blockers,
          } satisfies SendPreviewResponse)
        : json(200, {
            sending: { revisionId: REV, state: 'draft', sentAt: null, contentHash: null, validUntil: null, links: [] },
          }),
    );
    renderWithApp(<QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'draft' }} />);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Send…' }));
    const list = await screen.findByTestId('send-blockers');
    expect(list.textContent).toContain('2 circuit errors not accepted');
    expect(within(list).getByRole('note').textContent).toContain('licensed electrician');
    const group = within(list).getByRole('region', { name: 'Errors in circuit Front path: Path string' });
    const link = within(group).getByRole('link', { name: 'Open circuit “Front path: Path string” →' });
    expect(link.getAttribute('href')).toBe(`/quotes/${QUOTE}/circuits?circuit=${CIRCUIT}`);
    // the group heading names the circuit, so each line is the finding alone
    expect(
      within(group)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([
      'This driver gives 700 mA but the fittings are set to 350 mA.',
      'Fitting 1 is driven at 700 mA, above its 350 mA rating.',
    ]);
    expect((screen.getByRole('button', { name: 'Send quote' }) as HTMLButtonElement).disabled).toBe(true);
  });
});
