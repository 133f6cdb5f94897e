import type { EntityManager } from '@mikro-orm/core';
import { Seeder } from '@mikro-orm/seeder';
import { ProductInput, type QuoteEventType } from '@gloaming/contracts';
import { Customer, Organization, Product, Quote, QuoteEvent, QuoteRevision, Site, User } from '../entities';
import { contentHash } from '../content-hash';
import { newId } from '../ids';
import { hashPassword } from '../passwords';
import { revisionSettingsOf, revisionTotalsOf } from '../revision-pricing';
import { DEMO_ACCOUNTS, DEMO_FIRM } from './demo-accounts';
import { DEMO_PRODUCTS } from './demo-catalogue';
import { DEMO_CUSTOMERS } from './demo-customers';
import { DEMO_QUOTES, demoEstimate, demoTotals, type DemoQuoteStep } from './demo-quotes';
import { demoInstallerJob } from './demo-installer-job';
import { demoYear } from './demo-year';

/** What the steps so far have made, for the steps after them. */
export interface DemoContext {
  now: Date;
  firm: Organization;
  users: Map<string, User>;
  products: Map<string, { input: ProductInput; id: string }>;
  customers: Map<string, { customer: Customer; sites: Site[] }>;
}

/** One part of the demo; each step persists what it makes and the seeder flushes after it. */
export type DemoStep = (em: EntityManager, ctx: DemoContext) => Promise<void> | void;

const DAY_MS = 24 * 3600_000;
const daysBefore = (now: Date, days: number) => new Date(now.getTime() - days * DAY_MS);

async function firmAndPeople(em: EntityManager, ctx: DemoContext): Promise<void> {
  const hashes = new Map<string, string>();
  for (const account of DEMO_ACCOUNTS) {
    const hash = hashes.get(account.password) ?? (await hashPassword(account.password));
    hashes.set(account.password, hash);
    const user = em.create(User, {
      organization: ctx.firm,
      email: account.email,
      name: account.name,
      role: account.role,
      passwordHash: hash,
    });
    ctx.users.set(account.email, user);
  }
}

function catalogue(em: EntityManager, ctx: DemoContext): void {
  for (const entry of DEMO_PRODUCTS) {
    const input = ProductInput.parse(entry); // the demo obeys the same rules as the catalogue form
    const id = newId(); // known now: the demo quotes' lines refer to it
    em.create(Product, { id, organization: ctx.firm, ...input, spec: input.spec as Record<string, unknown> });
    ctx.products.set(input.supplierCode, { input: entry, id });
  }
}

function customers(em: EntityManager, ctx: DemoContext): void {
  for (const c of DEMO_CUSTOMERS) {
    const customer = em.create(Customer, {
      organization: ctx.firm,
      name: c.name,
      email: c.email,
      phone: c.phone,
      notes: c.notes,
    });
    const sites = c.sites.map((s) => em.create(Site, { organization: ctx.firm, customer, ...s }));
    ctx.customers.set(c.key, { customer, sites });
  }
}

const EVENT_OF_STEP: Record<DemoQuoteStep, QuoteEventType> = {
  created: 'created',
  sent: 'sent',
  viewed: 'viewed',
  approved: 'approved',
};

function quotes(em: EntityManager, ctx: DemoContext): void {
  const settings = revisionSettingsOf(ctx.firm);
  DEMO_QUOTES.forEach((q, i) => {
    const number = i + 1;
    const owner = ctx.customers.get(q.customer);
    const estimator = ctx.users.get(q.estimator);
    if (!owner || !estimator) throw new Error(`Demo quote ${number} names an unknown customer or estimator.`);
    const content = demoEstimate(number, q, ctx.products, settings);
    const totals = revisionTotalsOf(demoTotals(content, settings));
    const at = (step: DemoQuoteStep) => {
      const h = q.history.find((e) => e.step === step);
      return h ? daysBefore(ctx.now, h.daysAgo) : null;
    };
    const created = at('created') ?? ctx.now;
    const sentAt = at('sent');
    const last = q.history[q.history.length - 1]!.step;
    const quote = em.create(Quote, {
      organization: ctx.firm,
      number,
      title: q.title,
      customer: owner.customer,
      site: owner.sites[q.site] ?? null,
      estimator,
      status: last === 'created' ? 'draft' : last,
      valueMinor: totals.totalMinor,
      sentAt,
      validUntil: sentAt ? new Date(sentAt.getTime() + settings.quoteValidityDays * DAY_MS) : null,
      createdAt: created,
      updatedAt: daysBefore(ctx.now, q.history[q.history.length - 1]!.daysAgo),
    });
    const revision = em.create(QuoteRevision, {
      organization: ctx.firm,
      quote,
      number: 1,
      state: sentAt ? 'sent' : 'draft',
      content,
      // a sent revision keeps the photos it showed (none in the demo)
      settings: sentAt ? { ...settings, sentPhotos: [] } : settings,
      totals,
      contentHash: sentAt ? contentHash(content) : null,
      sentAt,
      createdAt: created,
      updatedAt: sentAt ?? created,
    });
    for (const h of q.history)
      em.create(QuoteEvent, {
        organization: ctx.firm,
        quote,
        revision,
        type: EVENT_OF_STEP[h.step],
        actor: h.step === 'viewed' || h.step === 'approved' ? null : estimator,
        data: { revisionNumber: 1, ...(h.step === 'sent' && owner.customer.email ? { to: owner.customer.email } : {}) },
        at: daysBefore(ctx.now, h.daysAgo),
      });
  });
}

/**
 * The demo firm, in order: its people, its catalogue, its customers and a few quotes at
 * different stages. Add a step to the end to add more (the owner's year of history, say).
 */
export const DEMO_STEPS: readonly DemoStep[] = [firmAndPeople, catalogue, customers, quotes, demoInstallerJob, demoYear];

export class DemoSeeder extends Seeder {
  async run(em: EntityManager): Promise<void> {
    const ctx: DemoContext = {
      now: new Date(),
      firm: em.create(Organization, { ...DEMO_FIRM }),
      users: new Map(),
      products: new Map(),
      customers: new Map(),
    };
    for (const step of DEMO_STEPS) {
      await step(em, ctx);
      await em.flush();
    }
  }
}
