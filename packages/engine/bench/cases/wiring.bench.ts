/**
 * Schedule + wiring check: plan the connector blocks for a series string and check the
 * schedule it produces. Target (engine issue): 1,000 fittings under 10 ms; doubling the
 * string at most 2.3x the time.
 */
import { checkWiring, planConnectorBlocks, type BlockPlanInput } from '../../src/index';
import { pairedCases, runCase, type BenchResult } from '../harness';

function input(n: number): BlockPlanInput {
  return {
    string: {
      fittings: Array.from({ length: n }, (_, i) => ({
        id: `F${i + 1}`,
        label: `Path light ${i + 1}`,
        tail: { outerDiameterMm: 6.5, conductorMm2: 1.5 },
      })),
      driverLead: { outerDiameterMm: 8, conductorMm2: 2.5 },
      linkCable: { lengthM: 8, outerDiameterMm: 8, conductorMm2: 2.5 },
    },
    blockType: {
      name: 'Bench 12-way',
      terminals: 12,
      cableEntries: 12,
      conductorsPerTerminal: 2,
      ipCode: 'IP68',
      entrySealRangeMm: { min: 7, max: 12 },
      terminalRangeMm2: { min: 0.5, max: 4 },
    },
  };
}

function scheduleAndCheck(data: BlockPlanInput): boolean {
  const plan = planConnectorBlocks(data);
  const result = checkWiring(plan);
  if (!result.ok) throw new Error('bench schedule failed its own check');
  return result.ok;
}

export default function wiringBench(): BenchResult[] {
  const n1000 = input(1000);
  const n2000 = input(2000);
  const small = input(12);
  const plan1000 = planConnectorBlocks(n1000);
  return [
    runCase({ name: 'blocks+wiring: schedule and check, 12 fittings', run: () => scheduleAndCheck(small) }),
    runCase({ name: 'blocks+wiring: schedule and check, 1000 fittings', run: () => scheduleAndCheck(n1000), targetMs: 10 }),
    runCase({ name: 'blocks+wiring: check only, 1000 fittings', run: () => checkWiring(plan1000) }),
    pairedCases('blocks+wiring: doubling 1000 -> 2000 fittings', () => scheduleAndCheck(n1000), () => scheduleAndCheck(n2000), {
      maxRatio: 2.3,
    }),
  ];
}
