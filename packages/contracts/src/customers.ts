import { z } from 'zod';
import { Email } from './auth';

/**
 * Customers (homeowners and clients of the firm) and their sites (where the work happens).
 * Both carry a `version` for optimistic locking: an update names the version it was based on,
 * and a stale one is answered 409.
 */

const text = (max: number, what: string) => z.string().trim().max(max, `${what} is at most ${max} characters.`);

/** An e-mail address or nothing: an empty string becomes null. */
const OptionalEmail = z
  .union([z.null(), z.literal(''), Email])
  .optional()
  .transform((value) => (value ? value : null));

/** A phone number as people write it: digits, spaces, +, -, brackets, dots. Empty becomes null. */
const OptionalPhone = z
  .union([
    z.null(),
    z
      .string()
      .trim()
      .max(40, 'A phone number is at most 40 characters.')
      .regex(/^[0-9+()\-. ]*$/, 'Use digits, spaces and + - ( ) only.'),
  ])
  .optional()
  .transform((value) => (value ? value : null));

export const Version = z.number({ error: 'The version this edit is based on is missing.' }).int().min(1).max(1_000_000_000);

// -- sites

export const SiteInput = z.object({
  label: text(80, 'A label').default(''),
  addressLines: text(500, 'An address').min(1, 'Enter the address of the site.'),
  postcode: text(16, 'A postcode').default(''),
  accessNotes: text(2000, 'Access notes').default(''),
});
export type SiteInput = z.input<typeof SiteInput>;

export const SiteUpdate = SiteInput.extend({ version: Version });
export type SiteUpdate = z.input<typeof SiteUpdate>;

export const CustomerSite = z.object({
  id: z.string(),
  label: z.string(),
  addressLines: z.string(),
  postcode: z.string(),
  accessNotes: z.string(),
  version: z.number().int(),
});
export type CustomerSite = z.infer<typeof CustomerSite>;

// -- customers

export const MAX_SITES_PER_CUSTOMER = 50;

const customerFields = {
  name: text(120, 'A name').min(1, 'Enter the customer’s name.'),
  email: OptionalEmail,
  phone: OptionalPhone,
  notes: text(4000, 'Notes').default(''),
};

/** POST /api/customers: a customer with at least one site. */
export const CustomerInput = z.object({
  ...customerFields,
  sites: z
    .array(SiteInput)
    .min(1, 'Add at least one site: the address where the work happens.')
    .max(MAX_SITES_PER_CUSTOMER, `At most ${MAX_SITES_PER_CUSTOMER} sites per customer.`),
});
export type CustomerInput = z.input<typeof CustomerInput>;

/** PATCH /api/customers/:id: the customer's own fields; sites have their own routes. */
export const CustomerUpdate = z.object({ ...customerFields, version: Version });
export type CustomerUpdate = z.input<typeof CustomerUpdate>;

export const Customer = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  notes: z.string(),
  sites: z.array(CustomerSite),
  createdAt: z.string(),
  updatedAt: z.string(),
  version: z.number().int(),
});
export type Customer = z.infer<typeof Customer>;

export const CustomerResponse = z.object({ customer: Customer });
export type CustomerResponse = z.infer<typeof CustomerResponse>;

export const CustomerSummary = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  siteCount: z.number().int(),
  /** The first site's postcode, to tell two customers of the same name apart. */
  firstPostcode: z.string(),
  updatedAt: z.string(),
});
export type CustomerSummary = z.infer<typeof CustomerSummary>;

export const CUSTOMER_SORTS = ['name', 'createdAt', 'updatedAt'] as const;
export const CUSTOMER_CONTACT_FILTERS = ['all', 'with-email', 'without-email'] as const;
export type CustomerContactFilter = (typeof CUSTOMER_CONTACT_FILTERS)[number];

export const MAX_PAGE_SIZE = 100;

/** Query strings arrive as text: numbers are coerced, everything is bounded. */
export const PageQuery = {
  page: z.coerce.number('The page must be a number.').int('The page must be a whole number.').min(1, 'Pages start at 1.').max(100_000, 'That page is too far.').default(1),
  pageSize: z.coerce
    .number('The page size must be a number.')
    .int('The page size must be a whole number.')
    .min(1, 'Show at least 1 row.')
    .max(MAX_PAGE_SIZE, `Show at most ${MAX_PAGE_SIZE} rows a page.`)
    .default(25),
  search: z.string().trim().max(200, 'Search for at most 200 characters.').default(''),
  direction: z.enum(['asc', 'desc'], 'Sort direction is asc or desc.').default('asc'),
};

// GET /api/customers
export const CustomerListQuery = z.object({
  ...PageQuery,
  sort: z.enum(CUSTOMER_SORTS, `Sort by ${CUSTOMER_SORTS.join(', ')}.`).default('name'),
  contact: z.enum(CUSTOMER_CONTACT_FILTERS, `Filter by ${CUSTOMER_CONTACT_FILTERS.join(', ')}.`).default('all'),
});
export type CustomerListQuery = z.input<typeof CustomerListQuery>;

export const CustomerListResponse = z.object({
  customers: z.array(CustomerSummary),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type CustomerListResponse = z.infer<typeof CustomerListResponse>;

export const SiteResponse = z.object({ site: CustomerSite });
export type SiteResponse = z.infer<typeof SiteResponse>;

/** Path parameters for a customer's site. */
export const CustomerSiteParams = z.object({
  id: z.uuid('This id is not valid.'),
  siteId: z.uuid('This id is not valid.'),
});
