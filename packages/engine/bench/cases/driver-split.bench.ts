/**
 * Driver choice and splitting over an invented 2,000-driver catalogue. `chooseDrivers` screens
 * every driver and builds explanations only when read, so the timed cases that stand for a
 * screen also read what a screen shows: the first ten suitable drivers' reasons and results
 * and the first ten rejected drivers' reasons. The doubling case times the choice alone.
 */
import { chooseDrivers, splitRun, type DriverChoice, type RunToSplit } from '../../src/drivers';
import type { LedDriver, SeriesFitting } from '../../src/series';
import { runCase, pairedCases, type BenchResult } from '../harness';

/** A deterministic pseudo-random catalogue (invented drivers), so every run times the same work. */
function catalogue(size: number): LedDriver[] {
  let seed = 12345;
  const rnd = (): number => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648;
  };
  const currents = [0.35, 0.5, 0.7, 1.05];
  return Array.from({ length: size }, (_, k) => {
    const minV = 2 + Math.floor(rnd() * 20);
    const maxV = minV + 10 + Math.floor(rnd() * 40);
    return {
      id: `drv-${k}`,
      output: 'constant-current',
      currentA: currents[k % currents.length]!,
      voltageWindowV: { minV, maxV },
      efficiency: 0.85 + rnd() * 0.07,
      ipCode: rnd() < 0.8 ? 'IP66' : 'IP20',
      costMinor: 900 + Math.floor(rnd() * 4000),
    };
  });
}

function runOf(n: number): RunToSplit {
  const flex = { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } as const;
  const fittings: SeriesFitting[] = Array.from({ length: n }, (_, k) => ({
    id: `f${k}`,
    ratings: [
      { currentA: 0.35, forwardVoltageV: 2.8 + (k % 5) * 0.1 },
      { currentA: 0.7, forwardVoltageV: 3.0 + (k % 5) * 0.1 },
    ],
    ipCode: 'IP65',
    location: 'exposed-outdoor',
    tail: { length: { value: 1, unit: 'm' }, cable: flex },
  }));
  return {
    fittings,
    links: fittings.slice(1).map(() => ({ length: { value: 3, unit: 'm' }, cable: flex })),
    lead: { length: { value: 5, unit: 'm' }, cable: flex },
    driverLocation: 'driver-outdoors',
    profile: 'uk-iec',
  };
}

/** Read what a screen shows of a choice: ten suitable (reasons and figures) and ten rejected. */
function shown(choice: DriverChoice): number {
  let n = 0;
  for (const s of choice.suitable.slice(0, 10)) n += s.reasons.length + s.result.findings.length;
  for (const r of choice.rejected.slice(0, 10)) n += r.reasons.length;
  return n;
}

export default function driverSplitBench(): BenchResult[] {
  const cat = catalogue(2000);
  const r200 = runOf(200);
  const layout200 = { fittings: r200.fittings, runs: [{ id: 'lead', role: 'driver-lead' as const, ...r200.lead }], driverLocation: r200.driverLocation, profile: r200.profile };
  const check = splitRun(r200, cat);
  if (!check.ok) throw new Error(`bench setup: the 200-fitting run did not split: ${check.findings[0]?.message ?? ''}`);
  const layout12 = { ...layout200, fittings: r200.fittings.slice(0, 12) };
  const cat1000 = catalogue(1000);
  return [
    runCase({
      name: 'drivers: choose + split 200 fittings over 2,000 drivers',
      run: () => [shown(chooseDrivers(layout200, cat)), splitRun(r200, cat)],
      targetMs: 50,
      iterations: 40,
    }),
    runCase({ name: 'drivers: choose for a 12-fitting string over 2,000 drivers (ten of each shown)', run: () => shown(chooseDrivers(layout12, cat)) }),
    pairedCases('drivers: choose over 1,000 -> 2,000 drivers (linear)', () => chooseDrivers(layout12, cat1000), () => chooseDrivers(layout12, cat), {
      maxRatio: 2.3,
    }),
  ];
}
