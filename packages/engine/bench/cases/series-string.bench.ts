import { runCase, pairedCases, type BenchResult } from '../harness';
import { checkSeriesString, type SeriesStringInput } from '../../src/series';

function stringOf(n: number): SeriesStringInput {
  return {
    driver: {
      id: 'bench-700',
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
      ratings: [
        { currentA: 0.35, forwardVoltageV: 2.9, lumens: 110 },
        { currentA: 0.7, forwardVoltageV: 3.1, lumens: 200 },
      ],
      ipCode: 'IP65',
      location: 'exposed-outdoor' as const,
      tail: { length: { value: 1, unit: 'm' as const }, cable: { kind: 'metric' as const, areaMm2: 0.75, conductorClass: 5 as const, coating: 'plain' as const } },
    })),
    runs: [
      { id: 'lead', role: 'driver-lead', length: { value: 10, unit: 'm' }, cable: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
      { id: 'link-1', role: 'link', length: { value: 4, unit: 'm' }, cable: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
    ],
    profile: 'uk-iec',
  };
}

export default function seriesStringBench(): BenchResult[] {
  const twelve = stringOf(12);
  const a = stringOf(200);
  const b = stringOf(400);
  return [
    runCase({ name: 'series: check a 12-fitting string', run: () => checkSeriesString(twelve), targetMs: 0.05 }),
    pairedCases('series: check string, 200 -> 400 fittings (linear)', () => checkSeriesString(a), () => checkSeriesString(b), { maxRatio: 2.3 }),
  ];
}
