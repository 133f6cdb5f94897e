import { z } from 'zod';

/** The firm as its own staff see it (GET /api/organization). Percentages in basis points. */
export const OrganizationSummary = z.object({
  id: z.string(),
  name: z.string(),
  addressLines: z.string(),
  vatNumber: z.string().nullable(),
  currency: z.string(),
  locale: z.string(),
  vatRateBp: z.number().int(),
  depositPercentBp: z.number().int(),
  markupPercentBp: z.number().int(),
  labourRateMinorPerHour: z.number().int(),
});
export type OrganizationSummary = z.infer<typeof OrganizationSummary>;

export const OrganizationResponse = z.object({ organization: OrganizationSummary });
export type OrganizationResponse = z.infer<typeof OrganizationResponse>;

/** Path parameter for a record id (our ids are UUIDs). */
export const IdParams = z.object({ id: z.uuid('This id is not valid.') });
export type IdParams = z.infer<typeof IdParams>;
