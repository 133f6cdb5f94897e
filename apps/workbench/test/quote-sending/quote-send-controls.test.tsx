import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { RevisionSendingState, SendPreviewResponse } from '@gloaming/contracts';
import { QuoteSendControls } from '../../src/features/quote-sending/components/quote-send-controls';
import { json, problem, stubFetch } from '../fetch-stub';
import { renderWithApp } from '../render';

afterEach(cleanup);

const QUOTE = '0b9f5d8e-1111-4c1e-9d7a-0a0b0c0d0e0f';
const REV = '0b9f5d8e-2222-4c1e-9d7a-0a0b0c0d0e0f';
const draftState: RevisionSendingState = {
  revisionId: REV,
  state: 'draft',
  sentAt: null,
  contentHash: null,
  validUntil: null,
  links: [],
};
const preview = (extra: Partial<SendPreviewResponse> = {}): SendPreviewResponse => ({
  to: 'ottilie@brackenbury.example',
  subject: 'Your garden lighting quotation Q-0001 from Nightjar Garden Lighting Ltd',
  text: 'Dear Ottilie Brackenbury,\n\nPlease find attached our quotation Q-0001 for £488.16 including VAT.',
  attachmentName: 'Quotation Q-0001 rev 1.pdf',
  blockers: [],
  ...extra,
});

describe('QuoteSendControls', () => {
  it('links the PDF of the revision and sends with the prefilled recipient and a note, saving first', async () => {
    const beforeSend = vi.fn(async () => ({ ok: true }) as const);
    const { sent } = stubFetch((r) => {
      if (r.url.includes('/send-preview')) return json(200, preview());
      if (r.url.endsWith('/send'))
        return json(201, {
          sentTo: 'ottilie@brackenbury.example',
          delivery: 'sent',
          sending: { ...draftState, state: 'sent', sentAt: '2026-12-01T10:00:00.000Z' },
        });
      return json(200, { sending: draftState });
    });
    renderWithApp(
      <QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'draft' }} beforeSend={beforeSend} />,
    );
    expect(screen.getByRole('link', { name: 'Download PDF' }).getAttribute('href')).toBe(
      `/api/quotes/${QUOTE}/revisions/${REV}/pdf`,
    );

    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Send…' }));
    const to = await screen.findByLabelText('Send to');
    await waitFor(() => expect((to as HTMLInputElement).value).toBe('ottilie@brackenbury.example'));
    expect(screen.getByTestId('send-preview').textContent).toContain('£488.16');
    await user.type(screen.getByLabelText(/Personal note/), 'Thank you for Thursday.');
    await user.click(screen.getByRole('button', { name: 'Send quote' }));

    await screen.findByText('Sent to ottilie@brackenbury.example.');
    expect(beforeSend).toHaveBeenCalledTimes(1);
    expect(sent.find((r) => r.url.endsWith('/send'))?.body).toEqual({
      to: 'ottilie@brackenbury.example',
      message: 'Thank you for Thursday.',
    });
  });

  it('sends nothing when the latest edits could not be saved, and says why', async () => {
    const beforeSend = vi.fn(async () => ({ ok: false, detail: 'Someone else saved this quote after you opened it.' }) as const);
    const { sent } = stubFetch((r) => (r.url.includes('/send-preview') ? json(200, preview()) : json(200, { sending: draftState })));
    renderWithApp(
      <QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'draft' }} beforeSend={beforeSend} />,
    );
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Send…' }));
    const to = await screen.findByLabelText('Send to');
    await waitFor(() => expect((to as HTMLInputElement).value).toBe('ottilie@brackenbury.example'));
    await user.click(screen.getByRole('button', { name: 'Send quote' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Nothing was sent: your latest edits are not saved yet');
    expect(alert.textContent).toContain('Someone else saved this quote after you opened it.');
    expect(beforeSend).toHaveBeenCalledTimes(1);
    expect(sent.some((r) => r.url.endsWith('/send'))).toBe(false);
    // the dialog stays open with what was typed, to try again once saved
    expect(screen.getByRole('button', { name: 'Send quote' })).toBeTruthy();
  });

  it("lists the server's blockers and does not offer to send", async () => {
    const { sent } = stubFetch((r) =>
      r.url.includes('/send-preview')
        ? json(
            200,
            preview({
              to: null,
              blockers: [
                {
                  code: 'customer-without-email',
                  message: 'Ottilie Brackenbury has no e-mail address. Add one to the customer before sending.',
                },
              ],
            }),
          )
        : json(200, { sending: draftState }),
    );
    renderWithApp(<QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'draft' }} />);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Send…' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('has no e-mail address');
    expect((screen.getByRole('button', { name: 'Send quote' }) as HTMLButtonElement).disabled).toBe(true);
    expect(sent.some((r) => r.method === 'POST')).toBe(false);
  });

  it('offers send again and revoke for a sent revision, and shows a refused send', async () => {
    const sentState: RevisionSendingState = {
      ...draftState,
      state: 'sent',
      sentAt: '2026-12-01T10:00:00.000Z',
      validUntil: '2026-12-31T10:00:00.000Z',
      links: [
        {
          id: 'l1',
          sentTo: 'o@b.example',
          createdAt: '2026-12-01T10:00:00.000Z',
          expiresAt: '2026-12-31T10:00:00.000Z',
          revokedAt: null,
          active: true,
          delivery: 'sent',
          deliveryAttempts: 1,
        },
      ],
    };
    stubFetch((r) => {
      if (r.url.includes('/send-preview')) return json(200, preview());
      if (r.url.endsWith('/resend'))
        return problem(502, { title: 'E-mail not sent', detail: 'The mail server did not accept the message.' });
      return json(200, { sending: sentState });
    });
    renderWithApp(<QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'sent' }} />);
    expect(await screen.findByText(/1 working link/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Send…' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Revoke links' })).toBeTruthy();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Send again…' }));
    await waitFor(() => expect((screen.getByLabelText('Send to') as HTMLInputElement).value).not.toBe(''));
    await user.click(screen.getByRole('button', { name: 'Send again' }));
    expect((await screen.findByRole('alert')).textContent).toContain('The mail server did not accept the message.');
  });

  it('says "queued" when the mail server has not taken the e-mail, and "failed" once the outbox gave up', async () => {
    const link = {
      id: 'l1',
      sentTo: 'ottilie@brackenbury.example',
      createdAt: '2026-12-01T10:00:00.000Z',
      expiresAt: '2026-12-31T10:00:00.000Z',
      revokedAt: null,
      active: true,
    };
    const queuedState: RevisionSendingState = {
      ...draftState,
      state: 'sent',
      sentAt: '2026-12-01T10:00:00.000Z',
      links: [{ ...link, delivery: 'queued', deliveryAttempts: 1 }],
    };
    const failedState: RevisionSendingState = { ...queuedState, links: [{ ...link, delivery: 'failed', deliveryAttempts: 8 }] };
    let stateNow: RevisionSendingState = draftState;
    stubFetch((r) => {
      if (r.url.includes('/send-preview')) return json(200, preview());
      if (r.url.endsWith('/send')) {
        stateNow = queuedState;
        return json(201, { sentTo: 'ottilie@brackenbury.example', delivery: 'queued', sending: queuedState });
      }
      return json(200, { sending: stateNow });
    });
    const view = renderWithApp(<QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'draft' }} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Send…' }));
    await waitFor(() => expect((screen.getByLabelText('Send to') as HTMLInputElement).value).not.toBe(''));
    await user.click(screen.getByRole('button', { name: 'Send quote' }));
    const status = await screen.findByRole('status');
    await waitFor(() => expect(status.textContent).toContain('queued'));
    expect(status.textContent).not.toMatch(/^Sent to/);

    view.unmount();

    // the summary of a sent revision whose e-mail was given up says so
    stateNow = failedState;
    renderWithApp(<QuoteSendControls quoteId={QUOTE} revision={{ id: REV, number: 1, state: 'sent' }} />);
    expect(await screen.findByText(/e-mail to ottilie@brackenbury\.example failed after 8 tries/)).toBeTruthy();
  });
});
