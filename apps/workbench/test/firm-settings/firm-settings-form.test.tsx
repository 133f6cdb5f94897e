/**
 * The owner's settings form: people's units in, the contract's out (12.5 % = 1250 bp, £45/h =
 * 4500 p, 1.5 m = 1500 mm by definition), the contract's messages before anything is sent, the
 * api's field errors beside their fields, and a stale-version 409 explained with a way out.
 */
import { QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DEFAULT_DESIGN_SETTINGS, type FirmSettingsResponse } from '@gloaming/contracts';
import { afterEach, describe, expect, it } from 'vitest';
import { FirmSettingsPage } from '../../src/features/firm-settings/components/firm-settings-page';
import { firmSettingsKeys } from '../../src/features/firm-settings/api/firm-settings-keys';
import { sessionKeys } from '../../src/features/session/api/session-keys';
import { createQueryClient } from '../../src/lib/query-client';
import { json, OWNER, problem, stubFetch, type SentRequest } from '../fetch-stub';
import { descriptionOf } from '../render';

afterEach(cleanup);

const stored: FirmSettingsResponse = {
  version: 3,
  logo: null,
  settings: {
    name: 'Alder Row Lighting',
    addressLines: '2 Quarry Lane\nHollinsby',
    vatNumber: null,
    currency: 'GBP',
    locale: 'en-GB',
    vatRateBp: 2000,
    vatRatesBp: [2000, 500, 0],
    vatRounding: 'line-nearest-1p',
    depositPercentBp: 3000,
    markupPercentBp: 3500,
    labourRateMinorPerHour: 4200,
    design: DEFAULT_DESIGN_SETTINGS,
    quoteValidityDays: 30,
    termsText: 'Payment within 14 days.',
    emailSenderName: '',
  },
};

function renderPage(reply: (r: SentRequest) => Response) {
  const { sent } = stubFetch(reply);
  const queryClient = createQueryClient();
  queryClient.setQueryData(sessionKeys.current(), OWNER);
  queryClient.setQueryData(firmSettingsKeys.current(), stored);
  render(
    <QueryClientProvider client={queryClient}>
      <FirmSettingsPage />
    </QueryClientProvider>,
  );
  return { sent, user: userEvent.setup() };
}

async function replace(user: ReturnType<typeof userEvent.setup>, label: string | RegExp, text: string) {
  const field = screen.getByLabelText(label);
  await user.clear(field);
  if (text) await user.type(field, text);
  return field;
}

describe('firm settings form', () => {
  it('shows the stored values in people’s units and sends the contract’s', async () => {
    const { sent, user } = renderPage((r) => (r.method === 'PUT' ? json(200, { ...stored, settings: (r.body as { settings: unknown }).settings, version: 4 }) : json(200, stored)));
    expect((screen.getByLabelText('Default markup (%)') as HTMLInputElement).value).toBe('35');
    expect((screen.getByLabelText('Cable cut length (m)') as HTMLInputElement).value).toBe('1');
    expect((screen.getByLabelText('VAT rates in use (%)') as HTMLInputElement).value).toBe('20, 5, 0');
    await replace(user, 'Default markup (%)', '12.5');
    await replace(user, 'Labour rate (GBP per hour)', '45');
    await replace(user, 'Cable cut length (m)', '1.5');
    await replace(user, 'Voltage-drop limit (% of nominal)', '4');
    await replace(user, 'Exposed outdoors', 'IP67');
    await replace(user, 'Terms and conditions', 'Balance on completion.');
    await user.selectOptions(screen.getByLabelText('Wiring rules'), 'us-nec');
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(sent.some((r) => r.method === 'PUT')).toBe(true));
    const put = sent.find((r) => r.method === 'PUT')!;
    expect(put.url).toBe('/api/organization/settings');
    const body = put.body as { version: number; settings: FirmSettingsResponse['settings'] };
    expect(body.version).toBe(3);
    expect(body.settings).toMatchObject({ markupPercentBp: 1250, labourRateMinorPerHour: 4500, termsText: 'Balance on completion.', vatNumber: null });
    // blank IP minimums are not sent (they mean "the usual one")
    expect(body.settings.design).toMatchObject({ cableCutLengthMm: 1500, voltageDropLimitBp: 400, codeProfile: 'us-nec', ipMinimums: { 'exposed-outdoor': 'IP67' } });
    expect(Object.keys(body.settings.design.ipMinimums)).toEqual(['exposed-outdoor']);
    await waitFor(() => expect(document.body.textContent).toContain('Settings saved'), { timeout: 5000 });
  }, 30_000);

  it('checks with the contract before sending: its messages sit beside the fields', async () => {
    const { sent, user } = renderPage(() => json(200, stored));
    const name = await replace(user, 'Firm name', '');
    const markup = await replace(user, 'Default markup (%)', '12.345');
    const rates = await replace(user, 'VAT rates in use (%)', '5, 0');
    const sender = await replace(user, 'E-mail sender name', 'Alder <sales>');
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    // messages defined in @gloaming/contracts (FirmSettings)
    await waitFor(() => expect(name.getAttribute('aria-invalid')).toBe('true'));
    expect(descriptionOf(name)).toBe('Enter the firm’s name.');
    expect(descriptionOf(markup)).toContain('The markup is a whole number of hundredths of a per cent.');
    expect(descriptionOf(sender)).toContain('A sender name cannot contain <, >, " or line breaks.');
    // the cross-field rule runs once every field is valid, so fix the rest and send again
    await replace(user, 'Firm name', 'Alder Row Lighting');
    await replace(user, 'Default markup (%)', '12.5');
    await replace(user, 'E-mail sender name', 'Alder Row');
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(descriptionOf(rates)).toContain('The list of VAT rates must include the standard rate.'));
    expect(sent.filter((r) => r.method === 'PUT')).toEqual([]);
  }, 30_000);

  it('puts the api’s field errors (problem+json paths) on their fields', async () => {
    const { user } = renderPage((r) =>
      r.method === 'PUT'
        ? problem(400, {
            title: 'Some fields need attention',
            detail: 'Some fields need attention.',
            errors: [
              { path: 'body.settings.vatNumber', message: 'A VAT number is letters, digits, spaces and dashes.' },
              { path: 'body.settings.design.cableSlackBp', message: 'At most 100 %.' },
            ],
          })
        : json(200, stored),
    );
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    const vat = screen.getByLabelText('VAT number');
    await waitFor(() => expect(vat.getAttribute('aria-invalid')).toBe('true'));
    expect(descriptionOf(vat)).toBe('A VAT number is letters, digits, spaces and dashes.');
    expect(descriptionOf(screen.getByLabelText('Cable slack (%)'))).toContain('At most 100 %.');
  });

  it('explains a stale version and loads the newer settings on request', async () => {
    const newer = { ...stored, version: 5, settings: { ...stored.settings, termsText: 'Someone else’s terms.' } };
    let gets = 0;
    const { user } = renderPage((r) => {
      if (r.method === 'PUT') return problem(409, { title: 'Conflict', detail: 'Someone else saved the settings first. Reload to see their changes.' });
      gets += 1;
      return json(200, newer);
    });
    await replace(user, 'Terms and conditions', 'Mine.');
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(await screen.findByText('Changed by someone else')).toBeTruthy();
    expect(screen.getByText(/Another owner saved the settings after you opened this page/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Load the newer settings' }));
    await waitFor(() => expect((screen.getByLabelText('Terms and conditions') as HTMLTextAreaElement).value).toBe('Someone else’s terms.'));
    expect(gets).toBeGreaterThan(0);
  }, 30_000);

  it('says changes apply to new quotes while sent ones keep theirs', () => {
    renderPage(() => json(200, stored));
    expect(screen.getByText('All changes saved')).toBeTruthy();
    expect(screen.getByText('Changes apply to new quotes')).toBeTruthy();
    expect(screen.getByText(/sent quotes above all, keep the prices, terms and design limits/)).toBeTruthy();
  });
});
