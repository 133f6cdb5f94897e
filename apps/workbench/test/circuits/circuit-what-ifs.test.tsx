/**
 * The larger-cable suggestion and the drive currents side by side, as the page shows them and
 * applies them. Figures: IEC 60228 Table 3, class 5 plain copper at 20 °C, 1.5 mm² 13.3 and
 * 2.5 mm² 7.98 ohm/km; drop worked at 70 °C, x 1.1965 (IEC 60287-1-1 alpha) [derived]; a series
 * string's voltage is the sum of its forward voltages (definition). Datasheet figures invented.
 */
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Product, type CcCircuitDesign } from '@gloaming/contracts';
import { evaluateCircuit } from '@gloaming/engine';
import { DriveCurrentComparison, LargerCable } from '../../src/features/circuits/components/circuit-what-ifs';

afterEach(cleanup);

const when = '2026-12-01T00:00:00.000Z';
const common = {
  supplier: 'Marshwick Supply',
  description: '',
  unit: 'each',
  active: true,
  createdAt: when,
  updatedAt: when,
  version: 1,
};
const id = (n: number) => `00000000-0000-4000-8000-0000000001${String(n).padStart(2, '0')}`;
const flex = (n: number, areaMm2: number) =>
  Product.parse({
    ...common,
    id: id(n),
    kind: 'cable',
    unit: 'm',
    supplierCode: `MW-F${n}`,
    name: `Flex ${areaMm2}`,
    costMinor: 100,
    listPriceMinor: 200,
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2, conductorClass: 5, coating: 'plain' } },
  });
const flex15 = flex(1, 1.5);
const flex25 = flex(2, 2.5);
const bollard = Product.parse({
  ...common,
  id: id(3),
  kind: 'fitting',
  supplierCode: 'MW-BL2',
  name: 'Heronsgate bollard',
  costMinor: 2500,
  listPriceMinor: 4600,
  spec: {
    driveMode: 'constant-current',
    ratings: [
      { currentA: 0.35, forwardVoltageV: 2.9, lumens: 110 },
      { currentA: 0.7, forwardVoltageV: 3.2, lumens: 200 },
    ],
    ipCode: 'IP66',
  },
});
const driver = (n: number, currentA: number, maxV: number, maxPowerW: number, costMinor: number) =>
  Product.parse({
    ...common,
    id: id(n),
    kind: 'driver',
    supplierCode: `MW-D${n}`,
    name: `Driver ${currentA * 1000} mA`,
    costMinor,
    listPriceMinor: costMinor * 2,
    spec: { currentA, voltageWindowV: { minV: 6, maxV }, maxPowerW, efficiencyPct: 88, ipCode: 'IP66' },
  });
const d350 = driver(4, 0.35, 48, 20, 2600);
const d700 = driver(5, 0.7, 42, 30, 3000);
// a 700 mA driver with room to spare: 12 x 3.2 V is 92 % of a 42 V window, under the 10 % headroom margin
const d700wide = { ...driver(6, 0.7, 56, 40, 3200), name: 'Driver 700 mA wide' };
const products = [flex15, flex25, bollard, d350, d700, d700wide];

const design = (currentA: number, driverId: string, leadM: number): CcCircuitDesign => ({
  kind: 'constant-current',
  driverProductId: driverId,
  driverLocation: 'driver-outdoors',
  fittings: Array.from({ length: 12 }, (_, i) => ({
    id: `f${i + 1}`,
    productId: bollard.id,
    label: '',
    location: 'exposed-outdoor' as const,
    driveCurrentA: currentA,
  })),
  driverLead: { cableProductId: flex15.id, lengthM: leadM, method: 'buried-trench' },
  links: [],
  extensions: [],
  connectorBlockProductId: null,
  assignment: null,
  acknowledgements: [],
});
const HOT = 1.1965;
const fmt = (v: number) => new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 }).format(v);

describe('LargerCable', () => {
  it('names the cable that brings the string into the window and applies it in one action', async () => {
    const d = design(0.7, d700.id, 200);
    const evaluation = evaluateCircuit(d, products, { profile: 'uk-iec' });
    const onChange = vi.fn();
    render(
      <LargerCable
        design={d}
        products={products}
        cables={[flex15, flex25]}
        profile="uk-iec"
        evaluation={evaluation}
        onChange={onChange}
        disabled={false}
      />,
    );
    const region = screen.getByRole('region', { name: 'Larger cable' });
    // 38.4 V + 0.7 A x 400 m x R(70 °C): 1.5 mm² -> 42.86 V, 2.5 mm² -> 41.07 V
    expect(region.textContent).toContain(
      `${fmt(38.4 + 0.7 * 400 * 0.0133 * HOT)} V → ${fmt(38.4 + 0.7 * 400 * 0.00798 * HOT)} V`,
    );
    expect(region.textContent).toContain('7.98 Ω/km');
    await userEvent.setup().click(within(region).getByRole('button', { name: 'Use the larger cable' }));
    expect(onChange).toHaveBeenCalledTimes(1);
    expect((onChange.mock.calls[0]![0] as CcCircuitDesign).driverLead!.cableProductId).toBe(flex25.id);
  });

  it('shows nothing when the cable causes no failure', () => {
    const d = design(0.35, d350.id, 10);
    render(
      <LargerCable
        design={d}
        products={products}
        cables={[flex15, flex25]}
        profile="uk-iec"
        evaluation={evaluateCircuit(d, products, { profile: 'uk-iec' })}
        onChange={() => {}}
        disabled={false}
      />,
    );
    expect(screen.queryByRole('region', { name: 'Larger cable' })).toBeNull();
  });
});

describe('DriveCurrentComparison', () => {
  it('puts the rated currents side by side and "use this" sets the current and its driver', async () => {
    const d = design(0.35, d350.id, 10);
    const onChange = vi.fn();
    render(
      <DriveCurrentComparison
        design={d}
        products={products}
        drivers={[d350, d700, d700wide]}
        profile="uk-iec"
        onChange={onChange}
        disabled={false}
      />,
    );
    const table = screen.getByTestId('drive-current-comparison');
    const text = table.textContent ?? '';
    expect(text).toContain('350 mA (now)');
    expect(text).toContain('2,400 lm (182 %)'); // 12 x 200 lm against 12 x 110 lm
    expect(text).toContain('Driver 700 mA wide'); // the wide-window one: the 42 V one has too little headroom
    expect(text).toContain('£332.00'); // 12 x £25.00 fittings + £32.00 driver (cost)
    expect(text).toContain('£616.00'); // 12 x £46.00 + £64.00 (list price)
    await userEvent.setup().click(within(table).getByRole('button', { name: 'Use 700 mA on Driver 700 mA wide' }));
    const next = onChange.mock.calls[0]![0] as CcCircuitDesign;
    expect(next.driverProductId).toBe(d700wide.id);
    expect(next.fittings.every((f) => f.driveCurrentA === 0.7)).toBe(true);
  });
});
