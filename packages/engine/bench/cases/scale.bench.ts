/**
 * Scale: the engine's linear cases at 1x, 4x and 16x their input, with the growth of the
 * median against 1x. The three sizes are measured in the same run, alternating (each round
 * starts with a different size), and the median of the rounds' medians is reported. The
 * allowed growth follows the engine issue's doubling rule (at most 2.3x per doubling):
 * 4x is two doublings (2.3^2 = 5.29), 16x is four (2.3^4 = 27.98).
 */
import { checkWiring, planConnectorBlocks, type BlockPlanInput } from '../../src/index';
import { computeQuoteTotals } from '../../src/money';
import { checkSeriesString, type SeriesStringInput } from '../../src/series';
import { measure, type BenchResult } from '../harness';
import { estimate } from './money.bench';

const SCALES = [1, 4, 16] as const;
const PER_DOUBLING = 2.3;
const maxGrowth = (scale: number) => Math.round(PER_DOUBLING ** Math.log2(scale) * 100) / 100;

function seriesOf(n: number): SeriesStringInput {
  const flex = { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } as const;
  return {
    driver: {
      id: 'scale-700',
      output: 'constant-current',
      currentA: 0.7,
      voltageWindowV: { minV: 9, maxV: 4 * n },
      maxPowerW: 3 * n,
      efficiency: 0.88,
      ipCode: 'IP66/IP67',
    },
    driverLocation: 'driver-outdoors',
    fittings: Array.from({ length: n }, (_, k) => ({
      id: `f${k}`,
      ratings: [{ currentA: 0.7, forwardVoltageV: 3.1, lumens: 200 }],
      ipCode: 'IP65',
      location: 'exposed-outdoor' as const,
      tail: { length: { value: 1, unit: 'm' as const }, cable: flex },
    })),
    runs: [{ id: 'lead', role: 'driver-lead', length: { value: 10, unit: 'm' }, cable: flex }],
    profile: 'uk-iec',
  };
}

function blocksOf(n: number): BlockPlanInput {
  return {
    string: {
      fittings: Array.from({ length: n }, (_, i) => ({ id: `F${i + 1}`, label: `Spike light ${i + 1}`, tail: { outerDiameterMm: 6.5, conductorMm2: 1.5 } })),
      driverLead: { outerDiameterMm: 8, conductorMm2: 2.5 },
      linkCable: { lengthM: 8, outerDiameterMm: 8, conductorMm2: 2.5 },
    },
    blockType: {
      name: 'Scale 12-way',
      terminals: 12,
      cableEntries: 12,
      conductorsPerTerminal: 2,
      ipCode: 'IP68',
      entrySealRangeMm: { min: 7, max: 12 },
      terminalRangeMm2: { min: 0.5, max: 4 },
    },
  };
}

type ScaleResult = BenchResult & { scale: number; growth?: number; maxGrowth?: number };

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.max(0, Math.ceil(s.length / 2) - 1)]!;
}

function scaleCase(name: (size: number) => string, base: number, make: (size: number) => () => unknown, rounds = 7): ScaleResult[] {
  const runs = SCALES.map((s) => make(base * s));
  const medians: number[][] = SCALES.map(() => []);
  for (let r = 0; r < rounds; r++) {
    for (let k = 0; k < SCALES.length; k++) {
      const i = (k + r) % SCALES.length; // each round starts with a different size
      medians[i]!.push(median(measure(runs[i]!, 20).samples));
    }
  }
  const m = medians.map(median);
  return SCALES.map((s, i) => {
    const res: ScaleResult = { name: name(base * s), scale: s, iterations: rounds * 20, medianMs: Math.round(m[i]! * 10_000) / 10_000, p95Ms: Number.NaN };
    if (s > 1) {
      res.growth = Math.round((m[i]! / m[0]!) * 100) / 100;
      res.maxGrowth = maxGrowth(s);
      res.meetsTarget = res.growth <= res.maxGrowth;
    }
    res.note = `${s}x; ${rounds} alternating rounds`;
    return res;
  });
}

const n = (x: number) => x.toLocaleString('en-GB');

export default function scaleBench(): BenchResult[] {
  return [
    ...scaleCase((s) => `money totals, ${n(s)} lines`, 5000, (s) => {
      const q = estimate(s);
      return () => computeQuoteTotals(q);
    }),
    ...scaleCase((s) => `series string check, ${n(s)} fittings`, 12, (s) => {
      const input = seriesOf(s);
      return () => checkSeriesString(input);
    }),
    ...scaleCase((s) => `schedule + wiring check, ${n(s)} fittings`, 1000, (s) => {
      const input = blocksOf(s);
      return () => checkWiring(planConnectorBlocks(input)).ok;
    }, 5),
  ];
}
