/**
 * Engine: runs the engine's own benchmark (`npm run bench -w @gloaming/engine`, one JSON line
 * per case) in a child process and turns each line into a row: median and p95 beside the
 * engine issue's target, paired doubling cases as the ratio of medians, and the scale cases
 * (1x, 4x, 16x) as the growth against 1x.
 */
import { spawn } from 'node:child_process';
import { info, ms, type BenchRow, type Suite } from '../support/report';
import { repoRoot } from '../support/paths';

interface EngineLine {
  suite?: string;
  name?: string;
  iterations?: number;
  medianMs?: number;
  p95Ms?: number;
  targetMs?: number;
  targetOn?: 'median' | 'p95';
  targetRatio?: number;
  ratio?: number;
  meetsTarget?: boolean;
  note?: string;
  /** Scale cases: the input multiple (1, 4, 16) and the growth of the median against 1x. */
  scale?: number;
  growth?: number;
  maxGrowth?: number;
}

function toRow(l: EngineLine): BenchRow {
  const name = l.name ?? '(unnamed case)';
  const suite = l.scale !== undefined ? 'scale' : 'engine';
  if (l.scale !== undefined) {
    const grown = l.growth !== undefined ? `, growth ${l.growth.toFixed(2)}x vs 1x` : '';
    return {
      suite,
      case: `engine: ${name}`,
      figure: `median ${ms(l.medianMs ?? Number.NaN)}${grown}`,
      value: l.growth ?? l.medianMs ?? null,
      unit: l.growth !== undefined ? 'x' : 'ms',
      target: l.maxGrowth !== undefined ? `growth <= ${l.maxGrowth}x` : info,
      met: l.meetsTarget ?? null,
      ...(l.note ? { note: l.note } : {}),
    };
  }
  if (l.ratio !== undefined) {
    return {
      suite,
      case: name,
      figure: `ratio ${l.ratio.toFixed(2)}`,
      value: l.ratio,
      unit: 'x',
      target: l.targetRatio !== undefined ? `<= ${l.targetRatio}` : info,
      met: l.meetsTarget ?? null,
      ...(l.note ? { note: l.note } : {}),
    };
  }
  const on = l.targetOn ?? 'median';
  return {
    suite,
    case: name,
    figure: `median ${ms(l.medianMs ?? Number.NaN)}, p95 ${ms(l.p95Ms ?? Number.NaN)}`,
    value: (on === 'p95' ? l.p95Ms : l.medianMs) ?? null,
    unit: 'ms',
    target: l.targetMs !== undefined ? `${on} < ${l.targetMs} ms` : info,
    met: l.meetsTarget ?? null,
    note: [`${l.iterations ?? '?'} iterations`, l.note].filter(Boolean).join('; '),
  };
}

export const engineSuite: Suite = async ({ log }) => {
  const out = await new Promise<string>((resolve, reject) => {
    const child = spawn('npm', ['run', 'bench', '--silent', '-w', '@gloaming/engine'], { cwd: repoRoot, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => {
      stdout += d.toString();
      for (const line of d.toString().split('\n')) if (line.trim()) log(`  ${line.trim().slice(0, 160)}`);
    });
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolve(stdout) : reject(new Error(`engine bench exited ${code}: ${stderr.slice(-2000)}`))));
  });
  const rows: BenchRow[] = [];
  for (const line of out.split('\n')) {
    if (!line.startsWith('{')) continue;
    const parsed = JSON.parse(line) as EngineLine;
    if (parsed.name) rows.push(toRow(parsed));
  }
  return rows;
};
