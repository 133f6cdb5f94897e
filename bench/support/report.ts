/**
 * One row per benchmark case: the figure beside its target, and whether it was met. Rows
 * without a target (information only) have `met: null`; a case that could not run says why in
 * `figure` and has `met: null` too. Benchmarks report; they never fail a build.
 */
import { loadavg } from 'node:os';

export interface BenchRow {
  suite: string;
  case: string;
  /** The figure as printed, units included ("p95 31.2 ms"). */
  figure: string;
  /** The number the target is judged on, in `unit`, or null when not measured. */
  value: number | null;
  unit: string;
  /** The target as printed ("< 50 ms"), or "information" when there is none. */
  target: string;
  met: boolean | null;
  /** Anything the reader needs to judge the figure: sizes, sample counts, conditions. */
  note?: string;
}

export type Suite = (ctx: SuiteContext) => Promise<BenchRow[]>;

export interface SuiteContext {
  /** Shorter runs for debugging the harness (BENCH_QUICK=1); figures are then indicative only. */
  quick: boolean;
  log: (line: string) => void;
}

export const info = 'information';

export function row(r: BenchRow): BenchRow {
  return r;
}

/** A case that could not be measured, with the reason in place of a figure. */
export function unavailable(suite: string, name: string, target: string, reason: string): BenchRow {
  return { suite, case: name, figure: `not available: ${reason}`, value: null, unit: '', target, met: null };
}

export function ms(x: number): string {
  return `${x < 10 ? x.toFixed(2) : x.toFixed(1)} ms`;
}

export function kb(bytes: number): string {
  return `${(bytes / 1024).toFixed(1)} KB`;
}

export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

export const median = (values: readonly number[]): number => percentile(values, 50);

export function loadAverage(): string {
  return loadavg()
    .map((x) => x.toFixed(2))
    .join(' / ');
}

const verdict = (met: boolean | null): string => (met === null ? '—' : met ? 'yes' : '**no**');

/** The markdown table: suite, case, figure, target, met? */
export function markdownTable(rows: readonly BenchRow[]): string {
  const esc = (s: string) => s.replaceAll('|', '\\|').replaceAll('\n', ' ');
  const lines = ['| suite | case | figure | target | met? |', '|---|---|---|---|---|'];
  for (const r of rows) {
    const figure = r.note ? `${r.figure} (${r.note})` : r.figure;
    lines.push(`| ${esc(r.suite)} | ${esc(r.case)} | ${esc(figure)} | ${esc(r.target)} | ${verdict(r.met)} |`);
  }
  return lines.join('\n');
}
