/**
 * A tiny benchmark harness: runs a case many times, prints one JSON line per case with
 * the median and p95 in milliseconds beside its target. Benchmarks never fail a build;
 * they report. Use `pairedCases` when a ratio between two variants is asked for: both
 * sides are measured in the same run, alternating, and the ratio of medians reported.
 *
 * Run under `node --expose-gc` (the `bench` script does): before every block (its warm-up,
 * then its timed iterations) the harness collects the garbage left by whatever ran before,
 * so each block pays for its own garbage only. Without --expose-gc the figures are still printed, with a note.
 */
import { performance } from 'node:perf_hooks';

export interface BenchCase {
  name: string;
  /** Work for one iteration. Return a value so the optimiser cannot drop the work. */
  run: () => unknown;
  /** Target for the median (or p95 when targetOn is 'p95'), in ms. */
  targetMs?: number;
  targetOn?: 'median' | 'p95';
  /** Iterations to time (default chosen so the case takes about 0.5 s). */
  iterations?: number;
}

export interface BenchResult {
  name: string;
  iterations: number;
  medianMs: number;
  p95Ms: number;
  targetMs?: number;
  targetOn?: 'median' | 'p95';
  /** For paired cases: the largest ratio b/a the target allows. */
  targetRatio?: number;
  meetsTarget?: boolean;
  note?: string;
}

function quantile(sorted: number[], q: number): number {
  if (sorted.length === 0) return Number.NaN;
  const idx = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[idx]!;
}

let sink: unknown;

/** The collector when node runs with --expose-gc, else null (figures then carry a note). */
const collect: (() => void) | null = typeof globalThis.gc === 'function' ? globalThis.gc : null;

/** Note added to every result when the collector is not exposed. */
const GC_NOTE = 'run without --expose-gc: earlier garbage may be collected inside this timing';

function withGcNote(note: string | undefined): string | undefined {
  if (collect) return note;
  return note === undefined ? GC_NOTE : `${note}; ${GC_NOTE}`;
}

/**
 * Time single iterations; for sub-microsecond work, batch so each sample is measurable.
 * Before the warm-up, the garbage of everything before is collected (with --expose-gc), so
 * the timed iterations pay only for the garbage this case makes itself.
 */
export function measure(run: () => unknown, iterations?: number): { samples: number[]; iterations: number } {
  // Collect what earlier work left first, then warm up: a full collection also drops some
  // optimised code (code tied to objects that died), and the warm-up compiles it again
  // before anything is timed. The garbage the timed iterations then meet is their own.
  sink = undefined;
  collect?.();
  const warmStart = performance.now();
  let warm = 0;
  while (performance.now() - warmStart < 100 && warm < 10_000) {
    sink = run();
    warm++;
  }
  const perIter = (performance.now() - warmStart) / Math.max(1, warm);
  const batch = perIter < 0.01 ? Math.ceil(0.01 / Math.max(perIter, 1e-6)) : 1;
  const n = iterations ?? Math.max(20, Math.min(2000, Math.ceil(500 / Math.max(perIter * batch, 1e-3))));
  const samples: number[] = [];
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    for (let b = 0; b < batch; b++) sink = run();
    samples.push((performance.now() - t0) / batch);
  }
  return { samples, iterations: n * batch };
}

export function runCase(c: BenchCase): BenchResult {
  const { samples, iterations } = measure(c.run, c.iterations);
  samples.sort((a, b) => a - b);
  const medianMs = quantile(samples, 0.5);
  const p95Ms = quantile(samples, 0.95);
  const result: BenchResult = { name: c.name, iterations, medianMs: round(medianMs), p95Ms: round(p95Ms) };
  if (c.targetMs !== undefined) {
    result.targetMs = c.targetMs;
    result.targetOn = c.targetOn ?? 'median';
    result.meetsTarget = (result.targetOn === 'p95' ? p95Ms : medianMs) <= c.targetMs;
  }
  const note = withGcNote(undefined);
  if (note !== undefined) result.note = note;
  return result;
}

/**
 * Measure two variants alternating in one run (a b, b a, a b...) and report the ratio of the
 * medians b/a. Used for growth checks: a = input n, b = input 2n. Each block is collected
 * clean before it is timed (see `measure`), so neither side is charged for the other's garbage.
 */
export function pairedCases(
  name: string,
  a: () => unknown,
  b: () => unknown,
  opts: { rounds?: number; maxRatio?: number } = {},
): BenchResult & { ratio: number } {
  const rounds = opts.rounds ?? 15;
  const as: number[] = [];
  const bs: number[] = [];
  for (let r = 0; r < rounds; r++) {
    // a b, b a, a b...: a drift in machine load over the run falls on both sides alike
    if (r % 2 === 0) {
      as.push(median(measure(a, 30).samples));
      bs.push(median(measure(b, 30).samples));
    } else {
      bs.push(median(measure(b, 30).samples));
      as.push(median(measure(a, 30).samples));
    }
  }
  const ma = median(as);
  const mb = median(bs);
  const ratio = mb / ma;
  const res: BenchResult & { ratio: number } = {
    name,
    iterations: rounds * 60,
    medianMs: round(mb),
    p95Ms: round(quantile([...bs].sort((x, y) => x - y), 0.95)),
    ratio: round(ratio),
  };
  let note = `median at n ${round(ma)} ms, at 2n ${round(mb)} ms`;
  if (opts.maxRatio !== undefined) {
    res.targetRatio = opts.maxRatio;
    res.meetsTarget = ratio <= opts.maxRatio;
    note += `; target ratio <= ${opts.maxRatio}`;
  }
  res.note = withGcNote(note) ?? note;
  void sink;
  return res;
}

function median(xs: number[]): number {
  const s = [...xs].sort((x, y) => x - y);
  return quantile(s, 0.5);
}

function round(x: number): number {
  return Math.round(x * 10_000) / 10_000;
}
