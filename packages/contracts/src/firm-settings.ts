import { z } from 'zod';
import { DesignSettings, percentBpField } from './design-settings';
import { VatRounding } from './estimate';

/**
 * The firm's settings as the owner edits them (GET/PUT /api/organization/settings). Money is
 * integer minor units, percentages basis points, lengths millimetres. New quotes snapshot the
 * pricing and design parts into their revision settings; sent revisions keep what they had.
 */

const Text = (what: string, max: number) => z.string(`Enter ${what}.`).trim().max(max, `At most ${max} characters.`);

export const FIRM_CURRENCIES = ['GBP', 'EUR', 'USD'] as const;
export const FIRM_LOCALES = ['en-GB', 'en-IE', 'en-US'] as const;

const VatRate = percentBpField('a VAT rate', 10_000);

/** Everything the owner can change (the logo has its own upload route). */
export const FirmSettingsFields = z.object({
  name: Text('the firm’s name', 200).min(1, 'Enter the firm’s name.'),
  addressLines: Text('the address', 1000),
  vatNumber: Text('a VAT number', 40)
    .regex(/^[A-Za-z0-9 -]*$/, 'A VAT number is letters, digits, spaces and dashes.')
    .transform((v) => (v === '' ? null : v))
    .nullable(),
  currency: z.enum(FIRM_CURRENCIES, `The currency is one of ${FIRM_CURRENCIES.join(', ')}.`),
  locale: z.enum(FIRM_LOCALES, `The locale is one of ${FIRM_LOCALES.join(', ')}.`),
  /** The standard rate new lines get. */
  vatRateBp: VatRate,
  /** Every rate the firm uses (standard, reduced, zero); must include the standard one. */
  vatRatesBp: z.array(VatRate).min(1, 'Give at least one VAT rate.').max(6, 'At most 6 VAT rates.'),
  vatRounding: VatRounding,
  depositPercentBp: percentBpField('the deposit percentage', 10_000),
  markupPercentBp: z
    .number('Enter the markup.')
    .int('The markup is a whole number of hundredths of a per cent.')
    .min(0, 'Cannot be negative.')
    .max(100_000, 'At most 1000 %.'),
  labourRateMinorPerHour: z
    .number('Enter the hourly labour rate.')
    .int('Use whole minor units (pence).')
    .min(0, 'Cannot be negative.')
    .max(10_000_00, 'That rate is too large.'),
  design: DesignSettings,
  quoteValidityDays: z.number('Enter the days.').int('Whole days.').min(1, 'At least 1 day.').max(365, 'At most 365 days.'),
  termsText: Text('the terms', 20_000),
  /** Shown as the sender of quote e-mails ("Nightjar Garden Lighting"); empty uses the firm's name. */
  emailSenderName: Text('a sender name', 100).regex(/^[^<>"\r\n]*$/, 'A sender name cannot contain <, >, " or line breaks.'),
});

export const FirmSettings = FirmSettingsFields.superRefine((s, ctx) => {
  if (!s.vatRatesBp.includes(s.vatRateBp))
    ctx.addIssue({ code: 'custom', path: ['vatRatesBp'], message: 'The list of VAT rates must include the standard rate.' });
  if (new Set(s.vatRatesBp).size !== s.vatRatesBp.length)
    ctx.addIssue({ code: 'custom', path: ['vatRatesBp'], message: 'Each VAT rate once.' });
});
export type FirmSettings = z.infer<typeof FirmSettings>;
export type FirmSettingsInput = z.input<typeof FirmSettings>;

// PUT /api/organization/settings
export const UpdateFirmSettingsRequest = z.object({
  /** The version these settings were read at; someone else's newer save answers 409. */
  version: z.number('Send the version you read.').int().min(1),
  settings: FirmSettings,
});
export type UpdateFirmSettingsRequest = z.input<typeof UpdateFirmSettingsRequest>;

// GET/PUT /api/organization/settings
export const FirmSettingsResponse = z.object({
  settings: FirmSettingsFields,
  version: z.number().int(),
  /** Present when a logo is uploaded (GET /api/organization/logo serves it). */
  logo: z.object({ updatedAt: z.iso.datetime() }).nullable(),
});
export type FirmSettingsResponse = z.infer<typeof FirmSettingsResponse>;

export const LOGO_UPLOAD_FIELD = 'file';
export const LOGO_MAX_BYTES = 2 * 1024 * 1024;
