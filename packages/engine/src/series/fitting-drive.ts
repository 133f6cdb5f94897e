import { finding, type Finding } from '../findings';
import type { DriveRating, DriveStatus, SeriesFitting } from './series-types';

/** Currents within half a milliamp are the same rating (350 mA vs 0.350 A). */
export const CURRENT_TOLERANCE_A = 0.0005;

export interface ResolvedRating {
  currentA: number;
  forwardVoltageV: number;
  lumens: number | null;
}

/** Ratings sorted by current with forward voltage resolved (P / I when only power is given). */
export function resolveRatings(fitting: SeriesFitting, subject: string, what: string): { ratings: ResolvedRating[]; findings: Finding[] } {
  const findings: Finding[] = [];
  const raw: DriveRating[] = Array.isArray(fitting.ratings) ? fitting.ratings : [];
  if (raw.length === 0) {
    findings.push(finding('fitting-rating-missing', 'error', `${what} has no rated drive current.`, { subject }));
    return { ratings: [], findings };
  }
  const out: ResolvedRating[] = [];
  for (const r of raw) {
    const i = r.currentA;
    if (!Number.isFinite(i) || i <= 0) {
      findings.push(finding('fitting-rating-invalid', 'error', `${what} has a rated current that is not a positive number of amps.`, { subject }));
      continue;
    }
    let vf: number | undefined;
    if (r.forwardVoltageV !== undefined) vf = r.forwardVoltageV;
    else if (r.powerW !== undefined) vf = r.powerW / i;
    if (vf === undefined || !Number.isFinite(vf) || vf <= 0) {
      findings.push(
        finding('fitting-rating-invalid', 'error', `${what} needs a forward voltage or a power at ${i * 1000} mA.`, {
          subject,
          values: { currentA: i },
        }),
      );
      continue;
    }
    const lumens = r.lumens !== undefined && Number.isFinite(r.lumens) && r.lumens >= 0 ? r.lumens : null;
    if (out.some((o) => Math.abs(o.currentA - i) <= CURRENT_TOLERANCE_A)) {
      findings.push(finding('fitting-rating-invalid', 'error', `${what} lists ${i * 1000} mA twice.`, { subject }));
      continue;
    }
    out.push({ currentA: i, forwardVoltageV: vf, lumens });
  }
  out.sort((a, b) => a.currentA - b.currentA);
  return { ratings: out, findings };
}

export interface DriveAtCurrent {
  status: DriveStatus;
  forwardVoltageV: number;
  lumens: number | null;
}

/**
 * A fitting at drive current `currentA`:
 * - equal to a rating: that rating;
 * - between two ratings: forward voltage and light interpolated linearly (status `between-ratings`);
 * - above every rating: `above-rating` (destroys it), forward voltage of the top rating;
 * - below every rating: `below-rating` (runs dim), forward voltage of the bottom rating (a
 *   conservative figure for the compliance voltage).
 */
export function driveAtCurrent(ratings: readonly ResolvedRating[], currentA: number): DriveAtCurrent {
  if (ratings.length === 0) return { status: 'no-rating', forwardVoltageV: 0, lumens: null };
  const first = ratings[0]!;
  const last = ratings[ratings.length - 1]!;
  for (const r of ratings) {
    if (Math.abs(r.currentA - currentA) <= CURRENT_TOLERANCE_A) {
      return { status: 'rated', forwardVoltageV: r.forwardVoltageV, lumens: r.lumens };
    }
  }
  if (currentA > last.currentA) return { status: 'above-rating', forwardVoltageV: last.forwardVoltageV, lumens: null };
  if (currentA < first.currentA) return { status: 'below-rating', forwardVoltageV: first.forwardVoltageV, lumens: null };
  let k = 0;
  while (ratings[k + 1]!.currentA < currentA) k++;
  const a = ratings[k]!;
  const b = ratings[k + 1]!;
  const t = (currentA - a.currentA) / (b.currentA - a.currentA);
  const lumens = a.lumens !== null && b.lumens !== null ? a.lumens + t * (b.lumens - a.lumens) : null;
  return { status: 'between-ratings', forwardVoltageV: a.forwardVoltageV + t * (b.forwardVoltageV - a.forwardVoltageV), lumens };
}

/** Whether a constant-current driver at `currentA` may drive the fitting without an error or a dim warning. */
export function acceptsCurrent(status: DriveStatus): boolean {
  return status === 'rated' || status === 'between-ratings';
}
