import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { newId } from '../ids';

const p = defineEntity.properties;

/**
 * The contractor firm: the tenant. Percentages are basis points (2000 = 20 %), money is
 * integer minor units of `currency` (pence for GBP).
 */
export const Organization = defineEntity({
  name: 'Organization',
  tableName: 'organizations',
  properties: {
    id: p.string().primary().onCreate(() => newId()),
    name: p.string(),
    addressLines: p.text().default(''),
    vatNumber: p.string().nullable(),
    currency: p.string().length(3).default('GBP'),
    locale: p.string().default('en-GB'),
    vatRateBp: p.integer().default(2000),
    depositPercentBp: p.integer().default(3000),
    markupPercentBp: p.integer().default(3500),
    labourRateMinorPerHour: p.integer().default(4500),
    /** HMRC Notice 700 §17.5 rounding choice, as the engine names it (e.g. 'line-nearest-1p'). */
    vatRounding: p.string().default('line-nearest-1p'),
    quoteValidityDays: p.integer().default(30),
    termsText: p.text().default(''),
    logoPath: p.string().nullable(),
    /** Content type of the uploaded logo (image/png, image/jpeg or image/webp). */
    logoContentType: p.string().nullable(),
    /** Every VAT rate the firm uses (standard, reduced, zero), basis points; null means the standard rate only. */
    vatRatesBp: p.json<number[]>().nullable(),
    /**
     * Circuit-design settings (DesignSettings in the contracts: labour minutes, cable slack and
     * cut length, voltage-drop limit, driver headroom, minimum IP codes, code profile); null
     * until the owner saves them, read as the defaults.
     */
    designSettings: p.json<Record<string, unknown>>().nullable(),
    /** Shown as the sender of the firm's e-mails; empty means the firm's name. */
    emailSenderName: p.string().default(''),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Organization = InferEntity<typeof Organization>;
