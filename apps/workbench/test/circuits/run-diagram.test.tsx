/**
 * The constant-voltage run diagram: the supply, each run and its cable segments, every fitting
 * with the voltage expected across it and its drop, and polarity marked in symbols as well as
 * line style. The voltages are checked against the drop worked by hand, not just echoed.
 * Trade rules: each fitting draws P / V (the usual design figure); a two-core loop is
 * 2 x length x R per metre; a daisy-chain segment carries every load beyond it (REFERENCES,
 * voltage drop, derived); 1.5 mm² class 5 plain copper is 13.3 ohm/km at 20 °C (IEC 60228
 * Table 3) and x 1.1965 at the 70 °C working temperature (IEC 60228 Table 3, 70 °C derived).
 */
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { evaluateCircuit, type CvCircuitDesign, type DesignProduct } from '@gloaming/engine';
import { RunDiagram } from '../../src/features/circuits/components/run-diagram';

afterEach(cleanup);

const base = { costMinor: 0, listPriceMinor: 0, unit: 'each', supplierCode: '' };
const products: DesignProduct[] = [
  {
    ...base,
    id: 'psu',
    name: 'Moss 12 V 60 W',
    kind: 'cv-supply',
    spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP67' },
  },
  {
    ...base,
    id: 'glow',
    name: 'Deck glow 6 W',
    kind: 'fitting',
    spec: { driveMode: 'constant-voltage', nominalVoltageV: 12, powerW: 6, ipCode: 'IP67' },
  },
  {
    ...base,
    id: 'flex',
    name: 'Two-core flex 1.5 mm²',
    unit: 'm',
    kind: 'cable',
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
  },
];

const fitting = (id: string, label: string, spanLengthM: number) => ({
  id,
  productId: 'glow',
  label,
  location: 'under-decking' as const,
  spanLengthM,
});

const design: CvCircuitDesign = {
  kind: 'constant-voltage',
  supplyProductId: 'psu',
  supplyLocation: 'driver-outdoors',
  runs: [
    {
      id: 'deck',
      label: 'Deck edge',
      layout: 'daisy-chain',
      cableProductId: 'flex',
      method: 'surface-clipped',
      feederLengthM: 0,
      fittings: [fitting('a', 'Bench end', 5), fitting('b', 'Gate end', 5)],
    },
    {
      id: 'steps',
      label: 'Steps',
      layout: 'home-run',
      cableProductId: 'flex',
      method: 'surface-clipped',
      feederLengthM: 0,
      fittings: [fitting('c', 'Top step', 8)],
    },
  ],
  acknowledgements: [],
};

describe('RunDiagram', () => {
  it('labels the supply, each run and fitting, and the voltage and drop worked out for each fitting', () => {
    const cv = evaluateCircuit(design, products, { profile: 'uk-iec' }).cv!;
    render(<RunDiagram design={design} cv={cv} supplyName="Moss 12 V 60 W" />);
    const svg = screen.getByRole('img', { name: /Moss 12 V 60 W at 12 V feeds 3 fittings in parallel on 2 runs/ });
    const d = within(svg);
    expect(d.getByText('Supply')).toBeTruthy();
    expect(d.getByText('Moss 12 V 60 W')).toBeTruthy();
    expect(d.getByText(/^Run: Deck edge · daisy chain/)).toBeTruthy();
    expect(d.getByText(/^Run: Steps · home runs/)).toBeTruthy();
    for (const label of ['Bench end', 'Gate end', 'Top step']) expect(d.getByText(label)).toBeTruthy();

    // 6 W / 12 V = 0.5 A a fitting; a 5 m loop is 2 x 5 x 0.0133 x 1.1965 ohm
    const r5 = 2 * 5 * 0.0133 * 1.1965;
    const bench = 12 - 1.0 * r5; // the first span carries both fittings
    const gate = bench - 0.5 * r5;
    const top = 12 - 0.5 * (2 * 8 * 0.0133 * 1.1965); // its own 8 m cable
    expect(bench.toFixed(2)).toBe('11.84');
    for (const v of [bench, gate, top]) expect(d.getByText(`${v.toFixed(2)} V`)).toBeTruthy();
    for (const v of [bench, gate, top]) expect(d.getByText(`drop ${(((12 - v) / 12) * 100).toFixed(1)} %`)).toBeTruthy();

    // the cable segments: daisy-chain spans along the pair, the home run's own cable
    expect(d.getAllByText('5 m')).toHaveLength(2);
    expect(d.getByText('own 8 m')).toBeTruthy();
    // polarity in symbols, not only line style or colour
    expect(d.getAllByText('+').length).toBeGreaterThanOrEqual(5);
    expect(d.getAllByText('−').length).toBeGreaterThanOrEqual(5);
    expect(d.getByText('+ conductor')).toBeTruthy();
    expect(d.getByText('− conductor')).toBeTruthy();
  });

  it('marks a fitting beyond the drop limit in words', () => {
    const long: CvCircuitDesign = {
      ...design,
      runs: [{ ...design.runs[1]!, fittings: [fitting('c', 'Far lamp', 60)] }],
    };
    const cv = evaluateCircuit(long, products, { profile: 'uk-iec' }).cv!;
    // 60 m own cable: 12 - 0.5 x 2 x 60 x 0.0133 x 1.1965 = 11.05 V, a 7.96 % drop, over the 5 % default
    expect(cv.runs[0]!.fittings[0]!.withinDropLimit).toBe(false);
    render(<RunDiagram design={long} cv={cv} supplyName="Moss 12 V 60 W" />);
    expect(screen.getByText('✕ drop 8.0 %')).toBeTruthy();
  });
});
