/**
 * A year of the demo firm's quotes, so the owner's figures, the quote list and the activity log
 * show a living business: about 150 quotes across the two estimators, most with a circuit,
 * with a spread of outcomes (approved and paid, a few refunded, declined with reasons, expired,
 * open, drafts). Deterministic: a seeded PRNG (mulberry32) decides everything, and dates are
 * days before the seeding date, so every seed tells the same story ending today. All names,
 * streets and towns are invented.
 */
import type { EntityManager } from '@mikro-orm/core';
import { ProductInput, type QuoteEventType, type QuoteStatus } from '@gloaming/contracts';
import { evaluateCircuit, type CcCircuitDesign, type DesignProduct } from '@gloaming/engine';
import { Circuit, Customer, DepositPayment, Quote, QuoteApproval, QuoteEvent, QuoteRevision, Site, type User } from '../entities';
import { contentHash } from '../content-hash';
import { revisionSettingsOf, revisionTotalsOf } from '../revision-pricing';
import type { DemoContext } from './demo-seeder';
import { demoEstimate, demoTotals, type DemoQuote, type DemoQuoteLine } from './demo-quotes';

/** mulberry32: a small, well-known 32-bit PRNG; the same seed gives the same year. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const DEMO_YEAR_SEED = 20_260_601;
export const DEMO_YEAR_QUOTES = 150;

const DAY_MS = 86_400_000;
const FIRST = ['Amelia', 'Barnaby', 'Cressida', 'Dominic', 'Elspeth', 'Felix', 'Gwendolyn', 'Hamish', 'Imogen', 'Jasper', 'Kerensa', 'Lorcan', 'Maud', 'Niall', 'Orla', 'Piers', 'Rosalind', 'Silas', 'Tamsin', 'Wilf'];
const LAST = ['Ashcombe', 'Bellweather', 'Corrigan', 'Dunmore', 'Everleigh', 'Fairbairn', 'Greaves', 'Holloway', 'Ingleby', 'Jessop', 'Kettering', 'Lanyon', 'Marchbank', 'Northcott', 'Ollerton', 'Pennick', 'Quarrie', 'Rendell', 'Standish', 'Treloar'];
const STREETS = ['Hazel Rise', 'Kestrel Way', 'Old Tannery Lane', 'Quillon Road', 'Sedge Close', 'Withy Bank', 'Orchard Drove', 'Lantern Walk', 'Marram Street', 'Copse End'];
const TOWNS = [
  ['Fernhollow', 'FH'],
  ['Brackenbury', 'BK'],
  ['Eastwick Magna', 'EW'],
  ['Lower Sallow', 'LS'],
] as const;
const DECLINE_REASONS = [
  'Too expensive for us this year',
  'Went with another installer',
  'Decided to wait until next spring',
  'Too expensive for us this year',
  'Plans changed: moving house',
  '',
];

/** Areas of a garden as lines of demo catalogue codes; `n` scales with the job. */
const AREAS: { name: string; lines: (n: number) => DemoQuoteLine[] }[] = [
  { name: 'Front path', lines: (n) => [{ code: 'FTL-PL2', quantity: n }, { code: 'FTL-D350', quantity: 1 }, { code: 'FTL-C2-15', quantity: 6 * n }, { code: 'FTL-J3', quantity: n }, { code: 'LAB-FIT', quantity: n }, { code: 'LAB-TRN', quantity: 3 * n }] },
  { name: 'Trees', lines: (n) => [{ code: 'FTL-UP5', quantity: Math.max(2, n >> 1) }, { code: 'FTL-D700', quantity: 1 }, { code: 'FTL-C2-25', quantity: 8 * n }, { code: 'FTL-SPK', quantity: Math.max(2, n >> 1) }, { code: 'LAB-FIT', quantity: Math.max(2, n >> 1) }, { code: 'LAB-DRV', quantity: 1 }] },
  { name: 'Decking', lines: (n) => [{ code: 'FTL-DK1', quantity: 2 * n }, { code: 'FTL-D350', quantity: 1 }, { code: 'FTL-C2-15', quantity: 4 * n }, { code: 'FTL-J5', quantity: Math.ceil(n / 2) }, { code: 'LAB-FIT', quantity: 2 * n }] },
  { name: 'Garden wall', lines: (n) => [{ code: 'FTL-WL3', quantity: n }, { code: 'FTL-D700', quantity: 1 }, { code: 'FTL-C2-15', quantity: 5 * n }, { code: 'FTL-J3', quantity: n }, { code: 'LAB-FIT', quantity: n }] },
  { name: 'Pond', lines: (n) => [{ code: 'FTL-UW2', quantity: Math.max(2, n >> 1) }, { code: 'FTL-D500', quantity: 1 }, { code: 'FTL-C2-15', quantity: 5 * n }, { code: 'FTL-GLD', quantity: 2 }, { code: 'LAB-FIT', quantity: Math.max(2, n >> 1) }] },
  { name: 'Patio', lines: (n) => [{ code: 'FTL-ST24', quantity: 2 * n }, { code: 'FTL-PS24-100', quantity: 1 }, { code: 'FTL-C2-25', quantity: 6 * n }, { code: 'FTL-ENC', quantity: 1 }, { code: 'LAB-FIT', quantity: 2 * n }, { code: 'LAB-DRV', quantity: 1 }] },
];

type Step = { type: QuoteEventType; day: number; data?: Record<string, unknown>; byStaff: boolean };

/** Status after a history, as the quotes module's appendQuoteEvent would leave it. */
function statusAfter(steps: readonly Step[]): QuoteStatus {
  let status: QuoteStatus = 'draft';
  for (const s of steps) {
    if (s.type === 'viewed') status = status === 'sent' ? 'viewed' : status;
    else if (s.type === 'sent' || s.type === 'approved' || s.type === 'declined' || s.type === 'expired' || s.type === 'deposit-paid') status = s.type;
  }
  return status;
}

/**
 * A constant-current string for the quote's first area: its fittings in series on its driver
 * with a lead and links of the area's cable and its connector blocks, checked by the engine.
 */
function pathCircuit(area: { name: string; lines: DemoQuoteLine[] }, ctx: DemoContext, rnd: () => number): CcCircuitDesign | null {
  const byCode = (code: string) => ctx.products.get(code);
  const fitting = area.lines.map((l) => ({ l, p: byCode(l.code) })).find((x) => x.p?.input.kind === 'fitting');
  const driver = area.lines.map((l) => byCode(l.code)).find((p) => p?.input.kind === 'driver');
  const cable = area.lines.map((l) => byCode(l.code)).find((p) => p?.input.kind === 'cable');
  const block = area.lines.map((l) => byCode(l.code)).find((p) => p?.input.kind === 'connector-block');
  if (!fitting?.p || !driver || !cable || driver.input.kind !== 'driver' || fitting.p.input.kind !== 'fitting') return null;
  const current = driver.input.spec.currentA;
  const count = Math.min(fitting.l.quantity, 6);
  return {
    kind: 'constant-current',
    driverProductId: driver.id,
    driverLocation: 'driver-outdoors',
    fittings: Array.from({ length: count }, (_, i) => ({
      id: `f${i + 1}`,
      productId: fitting.p!.id,
      label: `${area.name} ${i + 1}`,
      location: area.name === 'Pond' ? ('submerged' as const) : ('exposed-outdoor' as const),
      driveCurrentA: current,
    })),
    driverLead: { cableProductId: cable.id, lengthM: Math.round(6 + rnd() * 14), method: 'buried-trench' },
    links: Array.from({ length: Math.max(0, count - 1) }, () => ({ cableProductId: cable.id, lengthM: Math.round(2 + rnd() * 5), method: 'buried-trench' as const })),
    extensions: [],
    connectorBlockProductId: block?.id ?? null,
    assignment: null,
    acknowledgements: [],
  };
}

export function demoYear(em: EntityManager, ctx: DemoContext): void {
  const rnd = mulberry32(DEMO_YEAR_SEED);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const between = (lo: number, hi: number) => lo + rnd() * (hi - lo);
  const settings = revisionSettingsOf(ctx.firm);
  const estimators = ['tomasz@nightjar.example', 'priya@nightjar.example'].map((e) => ctx.users.get(e)).filter((u): u is User => !!u);
  if (estimators.length !== 2) throw new Error('The demo year needs both demo estimators.');
  const designProducts: DesignProduct[] = [...ctx.products.values()].map(({ input, id }) => ({ ...ProductInput.parse(input), id }) as DesignProduct);
  const at = (day: number) => new Date(ctx.now.getTime() - day * DAY_MS);
  let number = 1000;

  // created days: more enquiries in spring and summer (a garden business), oldest first
  const createdDays: number[] = [];
  while (createdDays.length < DEMO_YEAR_QUOTES) {
    const day = Math.floor(rnd() * 360) + 2;
    const month = at(day).getUTCMonth();
    const season = month >= 2 && month <= 8 ? 1 : 0.45;
    if (rnd() < season) createdDays.push(day);
  }
  createdDays.sort((a, b) => b - a);

  for (const [i, createdDay] of createdDays.entries()) {
    const estimator = estimators[rnd() < 0.55 ? 0 : 1]!;
    const name = `${pick(FIRST)} ${pick(LAST)}`;
    const [town, area] = pick(TOWNS);
    const customer = em.create(Customer, {
      organization: ctx.firm,
      name,
      email: `${name.toLowerCase().replace(/[^a-z]+/g, '.')}@example.net`,
      phone: `01632 ${String(100000 + Math.floor(rnd() * 899999)).slice(0, 6)}`,
      notes: '',
      createdAt: at(createdDay + 3),
    });
    const site = em.create(Site, {
      organization: ctx.firm,
      customer,
      label: 'Home',
      addressLines: `${1 + Math.floor(rnd() * 120)} ${pick(STREETS)}\n${town}`,
      postcode: `${area}${1 + Math.floor(rnd() * 9)} ${1 + Math.floor(rnd() * 9)}${pick(['AB', 'DL', 'HQ', 'NW', 'RT', 'XE'])}`,
      createdAt: at(createdDay + 3),
    });
    const key = `year-${i}`;
    ctx.customers.set(key, { customer, sites: [site] });

    // job size: mostly one or two areas, a few large schemes
    const areaCount = rnd() < 0.5 ? 1 : rnd() < 0.7 ? 2 : 3;
    const scale = Math.round(between(3, rnd() < 0.15 ? 12 : 7));
    const start = Math.floor(rnd() * AREAS.length);
    const areas = Array.from({ length: areaCount }, (_, k) => AREAS[(start + k) % AREAS.length]!).map((a) => ({ name: a.name, lines: a.lines(scale) }));
    const demo: DemoQuote = {
      customer: key,
      site: 0,
      estimator: estimator.email,
      title: areas.map((a) => a.name).join(', '),
      introduction: 'Warm white throughout, as we discussed on site.',
      areas,
      discountBp: rnd() < 0.15 ? 500 : null,
      history: [],
    };
    number++;
    const content = demoEstimate(number, demo, ctx.products, settings);
    const totals = revisionTotalsOf(demoTotals(content, settings));

    // what became of it
    const steps: Step[] = [{ type: 'created', day: createdDay, byStaff: true }];
    const isDraft = createdDay < 20 ? rnd() < 0.35 : rnd() < 0.04;
    let sentDay: number | null = null;
    let validUntilDay: number | null = null;
    if (!isDraft) {
      sentDay = Math.max(0.1, createdDay - between(0.2, 4));
      validUntilDay = sentDay - settings.quoteValidityDays;
      steps.push({ type: 'sent', day: sentDay, data: { to: customer.email }, byStaff: true });
      if (rnd() < 0.88) {
        const viewDay = Math.max(0.05, sentDay - between(0.05, rnd() < 0.8 ? 2 : 9));
        if (viewDay < sentDay) {
          steps.push({ type: 'viewed', day: viewDay, byStaff: false });
          if (rnd() < 0.4 && viewDay > 1) steps.push({ type: 'viewed', day: viewDay - between(0.1, Math.min(viewDay, 4) - 0.05), byStaff: false });
          const decideDay = viewDay - between(0.5, 16);
          const r = rnd();
          if (decideDay > 0 && decideDay > validUntilDay && r < 0.5) {
            const depositMinor = totals.deposit?.depositMinor ?? 0;
            steps.push({ type: 'approved', day: decideDay, data: { totalMinor: totals.totalMinor, depositMinor }, byStaff: false });
            if (rnd() < 0.88) {
              const paidDay = Math.max(0.02, decideDay - between(0.02, 6));
              if (paidDay < decideDay) {
                steps.push({ type: 'deposit-paid', day: paidDay, data: { amountMinor: depositMinor, currency: settings.currency }, byStaff: false });
                if (rnd() < 0.05 && paidDay > 3)
                  steps.push({ type: 'refunded', day: paidDay - between(1, Math.min(paidDay, 20) - 0.5), data: { amountMinor: depositMinor, currency: settings.currency }, byStaff: true });
              }
            }
          } else if (decideDay > 0 && decideDay > validUntilDay && r < 0.78) {
            const reason = pick(DECLINE_REASONS);
            steps.push({ type: 'declined', day: decideDay, data: reason ? { reason } : {}, byStaff: false });
          }
        }
      }
      const decided = steps.some((s) => s.type === 'approved' || s.type === 'declined');
      if (!decided && validUntilDay > 0) steps.push({ type: 'expired', day: validUntilDay, byStaff: false });
    }
    steps.sort((a, b) => b.day - a.day);
    const last = steps[steps.length - 1]!;
    const sentAt = sentDay === null ? null : at(sentDay);

    const quote = em.create(Quote, {
      organization: ctx.firm,
      number,
      title: demo.title,
      customer,
      site,
      estimator,
      status: statusAfter(steps),
      valueMinor: totals.totalMinor,
      sentAt,
      validUntil: validUntilDay === null ? null : at(validUntilDay),
      createdAt: at(createdDay),
      updatedAt: at(last.day),
    });
    const revision = em.create(QuoteRevision, {
      organization: ctx.firm,
      quote,
      number: 1,
      state: sentAt ? 'sent' : 'draft',
      content,
      settings: sentAt ? { ...settings, sentPhotos: [] } : settings,
      totals,
      contentHash: sentAt ? contentHash(content) : null,
      sentAt,
      createdAt: at(createdDay),
      updatedAt: sentAt ?? at(createdDay),
    });
    for (const s of steps)
      em.create(QuoteEvent, {
        organization: ctx.firm,
        quote,
        revision,
        type: s.type,
        actor: s.byStaff ? (s.type === 'refunded' ? (ctx.users.get('harriet@nightjar.example') ?? estimator) : estimator) : null,
        data: { revisionNumber: 1, ...(s.data ?? {}) },
        at: at(s.day),
      });

    // most quotes carry their first area's string as a checked circuit
    if (rnd() < 0.8) {
      const design = pathCircuit(areas[0]!, ctx, rnd);
      if (design) {
        const evaluation = evaluateCircuit(design, designProducts, { profile: 'uk-iec' });
        em.create(Circuit, {
          organization: ctx.firm,
          revision,
          area: areas[0]!.name,
          name: `${areas[0]!.name} string`,
          kind: design.kind,
          position: 0,
          design: design as unknown as Record<string, unknown>,
          // stored as the circuits module stores it: through JSON once
          result: JSON.parse(JSON.stringify({ ok: evaluation.ok, blockingCount: evaluation.blockingCount, findings: evaluation.findings, evaluation })) as Record<string, unknown>,
          createdAt: at(createdDay),
          updatedAt: at(createdDay),
        });
      }
    }

    const approved = steps.find((s) => s.type === 'approved');
    if (approved && sentAt) {
      const approval = em.create(QuoteApproval, {
        organization: ctx.firm,
        quote,
        revision,
        selection: {},
        totals: totals as unknown as Record<string, unknown>,
        totalMinor: totals.totalMinor,
        depositMinor: totals.deposit?.depositMinor ?? 0,
        currency: settings.currency,
        signedName: name,
        termsAccepted: true,
        ipAddress: '192.0.2.10', // RFC 5737 documentation range
        userAgent: 'Demo browser',
        contentHash: contentHash(content),
        approvedAt: at(approved.day),
      });
      const paid = steps.find((s) => s.type === 'deposit-paid');
      if (paid) {
        const refunded = steps.some((s) => s.type === 'refunded');
        em.create(DepositPayment, {
          organization: ctx.firm,
          quote,
          approval,
          checkoutSessionId: `cs_demo_${number}`,
          paymentIntentId: `pi_demo_${number}`,
          amountMinor: approval.depositMinor,
          currency: settings.currency,
          state: refunded ? 'refunded' : 'paid',
          failureCode: null,
          paidAt: at(paid.day),
          refundedMinor: refunded ? approval.depositMinor : 0,
          createdAt: at(approved.day),
          updatedAt: at(paid.day),
        });
      }
    }
  }
}
