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
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    version: p.integer().version(),
  },
});
export type Organization = InferEntity<typeof Organization>;
