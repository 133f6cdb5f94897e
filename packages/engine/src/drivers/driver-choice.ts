import type { Finding } from '../findings';
import { roundForDisplay as r2 } from '../units/round';
import {
  driverIpFindings,
  evaluateDriver,
  evaluateDriverParts,
  fillDriverCore,
  headroomPctOf,
  prepareString,
  VERDICT,
  VERDICT_ELV_BASE,
  type DriverCore,
  type PreparedString,
} from '../series/series-string';
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

/**
 * A driver that fits. `reasons` and `result` are worked out when first read (and kept), so
 * ranking a catalogue of thousands costs one cheap screen per driver; JSON.stringify (via
 * `toJSON`) writes them out in full. Copy with `toJSON()`, not a spread or structuredClone.
 */
export interface SuitableDriver {
  driver: LedDriver;
  costMinor: number | null;
  headroomPct: number;
  /** Plain-English reasons it fits. */
  readonly reasons: string[];
  /** The full check of the string on this driver. */
  readonly result: SeriesStringResult;
}

/** A driver that does not fit; `reasons` are worked out when first read (see SuitableDriver). */
export interface RejectedDriver {
  driver: LedDriver;
  /** Every finding that rules it out, first the most telling. */
  readonly reasons: Finding[];
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

/** The findings that rule a driver out, first the most telling (empty when it fits). */
export function rejectionReasons(prepared: PreparedString, driver: LedDriver): Finding[] {
  const e = evaluateDriverParts(prepared, driver);
  const own = e.own.filter(rejectsDriver);
  const mismatch = e.cvSupply ? [] : e.atCurrent.rejecting;
  if (own.length === 0) return mismatch.slice();
  own.sort((a, b) => reasonRank(a) - reasonRank(b));
  // current mismatches rank after a broken record or a constant-voltage output, before the rest
  let k = 0;
  while (k < own.length && reasonRank(own[k]!) < CURRENT_RANK) k++;
  return own.slice(0, k).concat(mismatch, own.slice(k));
}

class ChosenDriver implements SuitableDriver {
  readonly #prepared: PreparedString;
  #result: SeriesStringResult | undefined;
  #reasons: string[] | undefined;
  constructor(
    prepared: PreparedString,
    readonly driver: LedDriver,
    readonly costMinor: number | null,
    readonly headroomPct: number,
  ) {
    this.#prepared = prepared;
  }
  get result(): SeriesStringResult {
    return (this.#result ??= evaluateDriver(this.#prepared, this.driver));
  }
  get reasons(): string[] {
    return (this.#reasons ??= whyItFits(this.driver, this.result));
  }
  toJSON(): { driver: LedDriver; costMinor: number | null; headroomPct: number; reasons: string[]; result: SeriesStringResult } {
    return { driver: this.driver, costMinor: this.costMinor, headroomPct: this.headroomPct, reasons: this.reasons, result: this.result };
  }
}

class RuledOutDriver implements RejectedDriver {
  readonly #prepared: PreparedString;
  #reasons: Finding[] | undefined;
  constructor(
    prepared: PreparedString,
    readonly driver: LedDriver,
  ) {
    this.#prepared = prepared;
  }
  get reasons(): Finding[] {
    return (this.#reasons ??= rejectionReasons(this.#prepared, this.driver));
  }
  toJSON(): { driver: LedDriver; reasons: Finding[] } {
    return { driver: this.driver, reasons: this.reasons };
  }
}

/** Verdict bits that rule a driver out under this profile (ELV limits only when an error). */
function rejectingVerdicts(prepared: PreparedString): number {
  let mask = VERDICT.voltageBelowWindow | VERDICT.voltageAboveWindow | VERDICT.powerBelowWindow | VERDICT.powerAboveWindow | VERDICT.headroomBelowMargin;
  const limits = prepared.profile.elvLimits;
  for (let k = 0; k < limits.length; k++) if (limits[k]!.severity === 'error') mask |= VERDICT_ELV_BASE << k;
  return mask;
}

/**
 * Rank a catalogue of drivers for a prepared string. Each driver is screened on its figures
 * alone (the same checks the full evaluation makes, see fillDriverCore); findings, messages
 * and full results are built only for the drivers someone reads.
 */
export function chooseDriversPrepared(prepared: PreparedString, catalogue: readonly LedDriver[]): DriverChoice {
  const suitable: SuitableDriver[] = [];
  const rejected: RejectedDriver[] = [];
  let core: DriverCore | undefined; // one record, reused for every driver
  const rejecting = rejectingVerdicts(prepared);
  const ipRejects = new Map<string, boolean>();
  for (const driver of catalogue) {
    core = fillDriverCore(prepared, driver, core);
    let out = !core.recordOk || (core.verdicts & rejecting) !== 0 || (!core.cvSupply && core.at.rejecting.length > 0);
    if (!out) {
      const key = driver.ipCode ?? '';
      let ip = ipRejects.get(key);
      if (ip === undefined) {
        ip = driverIpFindings(prepared, driver.ipCode).some(rejectsDriver);
        ipRejects.set(key, ip);
      }
      out = ip;
    }
    if (out) rejected.push(new RuledOutDriver(prepared, driver));
    else suitable.push(new ChosenDriver(prepared, driver, driver.costMinor ?? null, headroomPctOf(core) ?? 0));
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
