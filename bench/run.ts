/**
 * `npm run bench`: every benchmark of the product, one suite after another (this machine has
 * two cores; nothing runs beside a suite but the server it measures). Prints each suite's
 * progress, then the table (suite, case, figure, target, met?), and writes
 * bench/results/latest.json and bench/results/latest.md. Benchmarks report, they never fail:
 * the exit code is 0 unless the harness itself breaks.
 *
 *   npm run bench                       everything (the root script builds first)
 *   npm run bench -- --only=grid,api    some suites; written to results/partial.*.tmp instead
 *   BENCH_QUICK=1 npm run bench         short runs for working on the harness
 *   BENCH_COLD_INSTALL=1 npm run bench  also time a cold `npm ci` in a throwaway clone
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { apiSuite } from './suites/api';
import { bundlesSuite } from './suites/bundles';
import { engineSuite } from './suites/engine';
import { gridSuite } from './suites/grid';
import { lighthouseSuite } from './suites/lighthouse';
import { pdfSuite } from './suites/pdf';
import { startupSuite } from './suites/startup';
import { resultsDir } from './support/paths';
import { loadAverage, markdownTable, unavailable, type BenchRow, type Suite } from './support/report';

const SUITES: Array<[string, Suite]> = [
  ['engine', engineSuite],
  ['bundles', bundlesSuite],
  ['startup', startupSuite],
  ['api', apiSuite],
  ['pdf', pdfSuite],
  ['grid', gridSuite],
  ['lighthouse', lighthouseSuite],
];

const onlyArg = process.argv.find((a) => a.startsWith('--only='));
const only = onlyArg ? onlyArg.slice('--only='.length).split(',') : null;
const quick = process.env.BENCH_QUICK === '1';
const log = (line: string) => console.log(line);

const started = new Date();
const rows: BenchRow[] = [];
const loads: Record<string, string> = {};
for (const [name, suite] of SUITES) {
  if (only && !only.includes(name)) continue;
  const t0 = performance.now();
  loads[name] = loadAverage();
  log(`bench: ${name} (load average ${loads[name]})`);
  try {
    const got = await suite({ quick, log });
    rows.push(...got);
    for (const r of got) log(`  ${r.case}: ${r.figure} (target ${r.target})`);
  } catch (err) {
    const reason = err instanceof Error ? err.message.split('\n')[0]! : String(err);
    log(`  ${name} failed: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
    rows.push(unavailable(name, `${name} suite`, '—', `the suite failed: ${reason}`));
  }
  log(`bench: ${name} done in ${((performance.now() - t0) / 1000).toFixed(0)} s`);
}

const finished = new Date();
const machine = {
  cpus: cpus().length,
  cpuModel: cpus()[0]?.model ?? 'unknown',
  node: process.version,
  loadAverageAtStart: Object.values(loads)[0] ?? loadAverage(),
  loadAverageAtEnd: loadAverage(),
  loadAverageBySuite: loads,
};
const met = rows.filter((r) => r.met === true).length;
const missed = rows.filter((r) => r.met === false).length;
const table = markdownTable(rows);
const maxLoad = Math.max(...Object.values(loads).map((l) => Number(l.split(' / ')[0])), Number(machine.loadAverageAtEnd.split(' / ')[0]));
const loaded = maxLoad >= 3;
const md = [
  '# Benchmark results',
  '',
  `\`npm run bench\`, ${started.toISOString()} to ${finished.toISOString()}${quick ? ' (BENCH_QUICK: short runs, indicative only)' : ''}.`,
  `Machine: ${machine.cpus} cores (${machine.cpuModel}), Node ${machine.node}. Load average (1 / 5 / 15 min) at the start of each suite: ` +
    Object.entries(loads)
      .map(([k, v]) => `${k} ${v}`)
      .join('; ') +
    `; at the end ${machine.loadAverageAtEnd}.`,
  loaded
    ? `**The machine was loaded during this run** (1-minute load average up to ${maxLoad.toFixed(1)} on ${machine.cpus} cores): other work shared the CPUs, so timings are longer than on a quiet machine, and ratios measured side by side are the more trustworthy figures.`
    : 'The machine was quiet (1-minute load average below 3) throughout.',
  '',
  `${met} targets met, ${missed} missed, ${rows.length - met - missed} rows for information or not available. ` +
    'Benchmarks never fail CI and never run in `npm test`; see DEVELOPERS.md ("Benchmarks") for what each case measures, ' +
    'and [notes.md](notes.md) for what profiling found behind the misses.',
  '',
  table,
  '',
].join('\n');

mkdirSync(resultsDir, { recursive: true });
const json = `${JSON.stringify({ startedAt: started.toISOString(), finishedAt: finished.toISOString(), quick, machine, rows }, null, 2)}\n`;
if (only) {
  writeFileSync(join(resultsDir, 'partial.json.tmp'), json);
  writeFileSync(join(resultsDir, 'partial.md.tmp'), md);
} else {
  writeFileSync(join(resultsDir, 'latest.json'), json);
  writeFileSync(join(resultsDir, 'latest.md'), md);
}
console.log(`\n${table}\n`);
console.log(`${met} met, ${missed} missed; written to ${only ? 'bench/results/partial.*.tmp' : 'bench/results/latest.{json,md}'}`);
