import type { Finding } from '../findings';
import { roundForDisplay as r2 } from '../units/round';
import { assembleResult, evaluateDriverParts, prepareString, type PreparedString } from '../series/series-string';
import type { LedDriver, SeriesStringResult, StringLayout } from '../series/series-types';

/**
 * Whether a finding rules the driver out for this string. Fitting-only problems (a fitting's
 * IP code, a bad tail cable) are the same whatever the driver, so they do not reject one.
 */
export function rejectsDriver(f: Finding): boolean {
  if (f.code === 'current-above-rating' || f.code === 'current-below-rating') return true;
  if (f.subject === 'driver') return f.severity === 'error' || f.code === 'headroom-below-margin' || f.code === 'ip-code-missing';
  if (f.subject === 'string') return f.severity === 'error' && f.code !== 'string-empty';
  return false;
}

export interface SuitableDriver {
  driver: LedDriver;
  costMinor: number | null;
  headroomPct: number;
  /** Plain-English reasons it fits. */
  reasons: string[];
  result: SeriesStringResult;
}

export interface RejectedDriver {
  driver: LedDriver;
  /** Every finding that rules it out, first the most telling. */
  reasons: Finding[];
}

export interface DriverChoice {
  /** Cheapest first; equal cost, more headroom first; then by id. */
  suitable: SuitableDriver[];
  rejected: RejectedDriver[];
  /** Findings about the string itself (fitting IP codes, cables), the same for every driver. */
  stringFindings: Finding[];
}

const REASON_ORDER = [
  'driver-invalid',
  'cc-fitting-on-cv-supply',
  'current-above-rating',
  'current-below-rating',
  'driver-ip-short-of-location',
  'ip-code-malformed',
  'ip-code-missing',
  'driver-window-missing',
  'voltage-above-window',
  'voltage-below-window',
  'power-above-window',
  'power-below-window',
  'headroom-below-margin',
];

const CURRENT_RANK = REASON_ORDER.indexOf('current-above-rating');

function reasonRank(f: Finding): number {
  const i = REASON_ORDER.indexOf(f.code);
  return i < 0 ? REASON_ORDER.length : i;
}

function whyItFits(d: LedDriver, res: SeriesStringResult): string[] {
  const out = [`Runs at ${r2(res.currentA * 1000, 1)} mA, a current every fitting is rated for.`];
  const vw = d.voltageWindowV;
  if (vw) out.push(`The string needs ${r2(res.complianceVoltageV)} V, inside its ${vw.minV}-${vw.maxV} V window.`);
  const pw = d.powerWindowW;
  if (pw) out.push(`It draws ${r2(res.outputPowerW)} W, inside its ${pw.minW}-${pw.maxW} W window.`);
  if (res.headroomPct !== null) out.push(`${r2(res.headroomPct, 1)} % headroom below its maximum.`);
  if (d.ipCode) out.push(`${d.ipCode} suits where the driver goes.`);
  return out;
}

function compareSuitable(a: SuitableDriver, b: SuitableDriver): number {
  const ca = a.costMinor ?? Number.POSITIVE_INFINITY;
  const cb = b.costMinor ?? Number.POSITIVE_INFINITY;
  if (ca !== cb) return ca < cb ? -1 : 1;
  if (a.headroomPct !== b.headroomPct) return b.headroomPct - a.headroomPct;
  return a.driver.id < b.driver.id ? -1 : a.driver.id > b.driver.id ? 1 : 0;
}

/** Rank a catalogue of drivers for a prepared string. */
export function chooseDriversPrepared(prepared: PreparedString, catalogue: readonly LedDriver[]): DriverChoice {
  const suitable: SuitableDriver[] = [];
  const rejected: RejectedDriver[] = [];
  for (const driver of catalogue) {
    const e = evaluateDriverParts(prepared, driver);
    const own = e.own.filter(rejectsDriver);
    const mismatch = e.cvSupply ? [] : e.atCurrent.rejecting;
    if (own.length > 0 || mismatch.length > 0) {
      own.sort((a, b) => reasonRank(a) - reasonRank(b));
      // current mismatches rank after a broken record or a constant-voltage output, before the rest
      const early = own.filter((f) => reasonRank(f) < CURRENT_RANK);
      const late = own.filter((f) => reasonRank(f) >= CURRENT_RANK);
      rejected.push({ driver, reasons: early.concat(mismatch, late) });
    } else {
      const result = assembleResult(prepared, e);
      suitable.push({
        driver,
        costMinor: driver.costMinor ?? null,
        headroomPct: result.headroomPct ?? 0,
        reasons: whyItFits(driver, result),
        result,
      });
    }
  }
  suitable.sort(compareSuitable);
  return { suitable, rejected, stringFindings: prepared.layoutFindings };
}

/**
 * Given a string (without its driver) and a catalogue, list the drivers that fit, cheapest
 * first then most headroom, each with why it fits; and every rejected one with its reasons.
 */
export function chooseDrivers(layout: StringLayout, catalogue: readonly LedDriver[]): DriverChoice {
  return chooseDriversPrepared(prepareString(layout), catalogue);
}
