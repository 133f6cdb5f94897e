/**
 * Bad input gets a clear finding, never a crash: takeoff, labour and constant-voltage runs
 * fed malformed, JSON-like data (what a half-filled form or an old stored record can hold).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkCvRuns, type CvInput } from '../src/cv';
import { labour, type LabourInput } from '../src/labour';
import { takeoff, type TakeoffInput } from '../src/takeoff';

const junk = fc.oneof(
  fc.constant(undefined),
  fc.constantFrom(Number.MAX_SAFE_INTEGER, 1e300, -0, Number.NaN, Infinity),
  fc.constant(null),
  fc.integer(),
  fc.double(),
  fc.string({ maxLength: 5 }),
  fc.boolean(),
  fc.array(fc.integer(), { maxLength: 3 }),
  fc.dictionary(fc.string({ maxLength: 3 }), fc.integer(), { maxKeys: 3 }),
);
const maybe = <T>(arb: fc.Arbitrary<T>) => fc.oneof(arb, junk);

const itemArb = maybe(
  fc.record({
    productId: maybe(fc.constantFrom('fx', 'drv', 'cab', 'blk')),
    count: maybe(fc.oneof(fc.integer({ min: -2, max: 5 }), fc.integer({ min: 0, max: Number.MAX_SAFE_INTEGER }))),
  }),
);
const runArb = maybe(
  fc.record({
    cableProductId: maybe(fc.constantFrom('cab', 'fx')),
    length: maybe(
      fc.record({
        value: maybe(fc.oneof(fc.double({ min: -5, max: 50 }), fc.double({ min: 0, max: 1e20 }))),
        unit: maybe(fc.constantFrom('m', 'ft', 'yd')),
      }),
    ),
    method: maybe(fc.constantFrom('surface-clipped', 'buried-trench', 'in-duct', 'stapled')),
  }),
);
const circuitArb = maybe(
  fc.record({
    id: maybe(fc.constantFrom('a', 'b')),
    kind: maybe(fc.constantFrom('constant-current', 'constant-voltage', 'ac')),
    powerProductId: maybe(fc.constantFrom('drv', 'psu', 'fx')),
    fittings: maybe(fc.array(itemArb, { maxLength: 3 })),
    cableRuns: maybe(fc.array(runArb, { maxLength: 3 })),
    connectorBlocks: maybe(fc.array(itemArb, { maxLength: 2 })),
    seals: maybe(fc.array(itemArb, { maxLength: 2 })),
    accessories: maybe(fc.array(itemArb, { maxLength: 2 })),
  }),
);
const catalogueArb = maybe(
  fc.array(
    maybe(
      fc.record({
        id: maybe(fc.constantFrom('fx', 'drv', 'psu', 'cab', 'blk')),
        name: fc.string({ maxLength: 4 }),
        category: maybe(fc.constantFrom('fitting', 'driver', 'supply', 'cable', 'connector-block', 'lamp')),
        fittingKind: maybe(fc.constantFrom('spike', 'wall')),
        unitPriceMinor: maybe(fc.integer({ min: 0, max: 1000 })),
        cutLengthM: maybe(fc.double({ min: -1, max: 10 })),
      }),
    ),
    { maxLength: 6 },
  ),
);

describe('malformed input never crashes', () => {
  it('takeoff', () => {
    fc.assert(
      fc.property(
        maybe(fc.array(circuitArb, { maxLength: 4 })),
        catalogueArb,
        maybe(fc.record({ cableSlackBp: maybe(fc.integer({ min: -10, max: 5000 })), cableCutLengthM: maybe(fc.double()) })),
        (circuits, catalogue, settings) => {
          const r = takeoff({ circuits, catalogue, settings } as unknown as TakeoffInput);
          expect(Array.isArray(r.lines)).toBe(true);
          for (const l of r.lines) expect(Number.isSafeInteger(l.quantityMilli)).toBe(true);
        },
      ),
      { numRuns: 400 },
    );
  });

  it('labour', () => {
    const tableArb = maybe(
      fc.record({
        minutesPerFitting: maybe(fc.dictionary(fc.constantFrom('spike', 'wall'), maybe(fc.double({ min: -1, max: 60 })))),
        minutesPerDriver: maybe(fc.integer({ min: -1, max: 60 })),
        minutesPerConnectorBlock: maybe(fc.integer({ min: 0, max: 60 })),
        minutesPerMetre: maybe(fc.record({ 'in-duct': maybe(fc.double({ min: 0, max: 5 })) })),
        minutesPerCircuitTest: maybe(fc.integer({ min: 0, max: 60 })),
        rateMinorPerHour: maybe(fc.integer({ min: -1, max: 10_000 })),
      }),
    );
    fc.assert(
      fc.property(maybe(fc.array(circuitArb, { maxLength: 4 })), catalogueArb, tableArb, (circuits, catalogue, table) => {
        const r = labour({ circuits, catalogue, table } as unknown as LabourInput);
        expect(Number.isSafeInteger(r.priceMinor)).toBe(true);
        expect(r.lines.reduce((s, l) => s + l.priceMinor, 0)).toBe(r.priceMinor);
      }),
      { numRuns: 400 },
    );
  });

  it('constant-voltage runs', () => {
    const fittingArb = maybe(
      fc.record({
        id: maybe(fc.string({ maxLength: 2 })),
        powerW: maybe(fc.oneof(fc.double({ min: -1, max: 30 }), fc.constantFrom(1e300, Number.MAX_VALUE))),
        minVoltageV: maybe(fc.double({ min: -1, max: 12 })),
        nominalVoltageV: maybe(fc.constantFrom(12, 24, 0)),
        drive: maybe(fc.constantFrom('constant-current', 'constant-voltage')),
      }),
    );
    const spanArb = maybe(
      fc.record({
        length: maybe(
          fc.record({
            value: maybe(fc.oneof(fc.double({ min: -1, max: 30 }), fc.constantFrom(1e300, Number.MAX_VALUE))),
            unit: maybe(fc.constantFrom('m', 'ft')),
          }),
        ),
        fitting: fittingArb,
      }),
    );
    const cable = maybe(
      fc.record({
        kind: maybe(fc.constantFrom('metric', 'awg')),
        areaMm2: maybe(fc.constantFrom(1.5, 2.5, 3)),
        conductorClass: maybe(fc.constantFrom(1, 5, 7)),
        coating: maybe(fc.constantFrom('plain', 'tinned')),
        gauge: maybe(fc.integer({ min: 8, max: 18 })),
        stranding: maybe(fc.constantFrom('solid', 'stranded')),
      }),
    );
    const runArb2 = maybe(
      fc.record({
        id: maybe(fc.string({ maxLength: 2 })),
        layout: maybe(fc.constantFrom('daisy-chain', 'home-run', 'hub', 'ring')),
        cable,
        spans: maybe(fc.array(spanArb, { maxLength: 4 })),
        feeder: maybe(
          fc.record({ length: maybe(fc.record({ value: fc.double({ min: 0, max: 10 }), unit: fc.constant('m') })), cable }),
        ),
      }),
    );
    fc.assert(
      fc.property(
        maybe(
          fc.record({
            id: fc.constant('psu'),
            nominalVoltageV: maybe(fc.constantFrom(12, 24, 0)),
            ratedPowerW: maybe(fc.double({ min: -1, max: 200 })),
            output: maybe(fc.constantFrom('constant-current', 'constant-voltage')),
          }),
        ),
        maybe(fc.array(runArb2, { maxLength: 3 })),
        maybe(fc.constantFrom('uk-iec', 'us-nec')),
        maybe(fc.array(maybe(fc.record({ id: fc.string({ maxLength: 2 }), cable })), { maxLength: 3 })),
        maybe(
          fc.record({
            dropLimitPct: maybe(fc.double({ min: -1, max: 120 })),
            supplyLoadingLimitPct: maybe(fc.double({ min: -1, max: 120 })),
          }),
        ),
        (supply, runs, profile, cableOptions, firm) => {
          const r = checkCvRuns({ supply, runs, profile, cableOptions, firm, temperatureC: 20 } as unknown as CvInput);
          expect(Array.isArray(r.findings)).toBe(true);
          for (const run of r.runs) for (const f of run.fittings) expect(Number.isFinite(f.voltageV)).toBe(true);
          expect(Number.isFinite(r.loadingPct) && Number.isFinite(r.outputW)).toBe(true);
        },
      ),
      { numRuns: 400 },
    );
  });
});
