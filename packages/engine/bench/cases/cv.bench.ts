/**
 * Constant-voltage runs: a 12 V daisy chain of 20 fittings with a stocked-cable choice, and
 * the doubling check for a long chain (1,000 -> 2,000 fittings, target ratio <= 2.3).
 */
import type { CableSpec } from '../../src/cables/cable-spec';
import { checkCvRuns, type CvInput } from '../../src/cv';
import { metres } from '../../src/units/length';
import { pairedCases, runCase, type BenchResult } from '../harness';

const flex = (areaMm2: number): CableSpec => ({ kind: 'metric', areaMm2, conductorClass: 5, coating: 'plain' });

function chain(fittings: number): CvInput {
  return {
    supply: {
      id: 'psu',
      nominalVoltageV: 12,
      ratedPowerW: Math.max(100, fittings * 2),
      ipCode: 'IP67',
      location: 'driver-outdoors',
    },
    profile: 'uk-iec',
    runs: [
      {
        id: 'path',
        layout: 'daisy-chain',
        cable: flex(1.5),
        spans: Array.from({ length: fittings }, (_, k) => ({
          length: metres(0.5 + (k % 3)),
          fitting: {
            id: `f${k}`,
            powerW: 1 + (k % 4) * 0.5,
            minVoltageV: 10.5,
            ipCode: 'IP67',
            location: 'in-ground-walk-over' as const,
          },
        })),
      },
    ],
    cableOptions: [0.75, 1.5, 2.5, 4, 6, 10].map((a) => ({ id: `flex-${a}`, cable: flex(a) })),
  };
}

export default function cvBench(): BenchResult[] {
  const small = chain(20);
  const a = chain(1000);
  const b = chain(2000);
  for (let i = 0; i < 200; i++) checkCvRuns(a); // let the optimising compiler settle first
  return [
    runCase({ name: 'cv: 12 V daisy chain, 20 fittings, 6 stocked cables', run: () => checkCvRuns(small) }),
    runCase({ name: 'cv: 12 V daisy chain, 1,000 fittings, 6 stocked cables', run: () => checkCvRuns(a) }),
    pairedCases(
      'cv: daisy chain doubling 1,000 -> 2,000 fittings',
      () => checkCvRuns(a),
      () => checkCvRuns(b),
      { maxRatio: 2.3 },
    ),
  ];
}
