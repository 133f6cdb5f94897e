import type { CableSpec } from '../cables/cable-spec';
import { finding, type Finding } from '../findings';
import { checkIpForLocation, type InstallationLocation } from '../ip-code/installation-location';
import { elvErrorLimitV, type CodeProfile, type CodeProfileId } from '../profiles/code-profile';
import { acceptsCurrent, driveAtCurrent } from '../series/fitting-drive';
import { checkDriverRecord, driverLimits, evaluateDriver, prepareString, type PreparedString } from '../series/series-string';
import type { CableRun, FirmSettings, LedDriver, SeriesFitting, SeriesStringResult, StringLayout } from '../series/series-types';
import type { Length } from '../units/length';
import { roundForDisplay as r2 } from '../units/round';
import { rejectsDriver } from './driver-choice';

export interface RunCable {
  length: Length;
  cable: CableSpec;
}

/** An ordered run of fittings to share out over as few-cost drivers as possible. */
export interface RunToSplit {
  fittings: SeriesFitting[];
  /** links[k] joins fitting k and fitting k + 1 (n − 1 of them, 0-based). */
  links: RunCable[];
  /** The lead from each string's driver to its first fitting. */
  lead: RunCable;
  driverLocation?: InstallationLocation;
  profile: CodeProfileId | CodeProfile;
  firm?: FirmSettings;
  temperatureC?: number;
}

export interface SplitString {
  /** 0-based index of the first fitting and one past the last. */
  from: number;
  to: number;
  driver: LedDriver;
  costMinor: number;
  result: SeriesStringResult;
}

export interface SplitResult {
  ok: boolean;
  strings: SplitString[];
  totalCostMinor: number | null;
  /** Why it is impossible, or problems with the run itself. */
  findings: Finding[];
  /** Drivers left out before splitting (CV output, IP short of the location, no price...). */
  excludedDrivers: { driver: LedDriver; reasons: Finding[] }[];
}

const BLOCKING_CODES = new Set([
  'string-empty',
  'fitting-rating-missing',
  'fitting-rating-invalid',
  'cv-fitting-on-cc-driver',
  'length-invalid',
  'cable-spec-invalid',
  'cable-size-not-in-table',
  'awg-gauge-invalid',
]);

/** The layout of the contiguous string [from, to). */
export function segmentLayout(run: RunToSplit, from: number, to: number): StringLayout {
  const runs: CableRun[] = [{ id: 'lead', role: 'driver-lead', length: run.lead.length, cable: run.lead.cable }];
  for (let k = from; k < to - 1; k++) {
    const l = run.links[k]!;
    runs.push({ id: `link-${k + 1}`, role: 'link', length: l.length, cable: l.cable });
  }
  const layout: StringLayout = { fittings: run.fittings.slice(from, to), runs, profile: run.profile };
  if (run.driverLocation !== undefined) layout.driverLocation = run.driverLocation;
  if (run.firm !== undefined) layout.firm = run.firm;
  if (run.temperatureC !== undefined) layout.temperatureC = run.temperatureC;
  return layout;
}

/** Cheapest driver covering a compliance voltage, for one drive current. */
interface CurrentGroup {
  currentA: number;
  drivers: LedDriver[];
  lo: number[];
  hi: number[];
  maxHi: number;
  breaks: Float64Array;
  /** Element 2k is the point breaks[k]; 2k+1 the open gap after it. Value: driver index or −1. */
  cheapest: Int32Array;
  /** Per fitting: forward voltage plus tail drop, and whether the current suits it. */
  prefixV: Float64Array;
  bad: Uint8Array;
}

function buildGroup(
  currentA: number,
  drivers: LedDriver[],
  marginPct: number,
  elvMaxV: number,
  prepared: PreparedString,
): CurrentGroup | null {
  const factor = 1 - marginPct / 100;
  const keep: LedDriver[] = [];
  const lo: number[] = [];
  const hi: number[] = [];
  for (const d of drivers) {
    const lim = driverLimits(d);
    const l = Math.max(lim.voltageMinV ?? 0, lim.powerMinW !== null ? lim.powerMinW / currentA : 0);
    const h = Math.min(
      lim.voltageMaxV !== null ? lim.voltageMaxV * factor : Infinity,
      lim.powerMaxW !== null ? (lim.powerMaxW * factor) / currentA : Infinity,
      elvMaxV,
    );
    if (!(h >= l) || !Number.isFinite(h)) continue;
    keep.push(d);
    lo.push(l);
    hi.push(h);
  }
  if (keep.length === 0) return null;
  const all = [...lo, ...hi].sort((a, b) => a - b);
  const uniq: number[] = [];
  for (const x of all) if (uniq.length === 0 || x !== uniq[uniq.length - 1]) uniq.push(x);
  const breaks = Float64Array.from(uniq);
  const idx = (x: number): number => {
    let a = 0;
    let b = breaks.length - 1;
    while (a < b) {
      const m = (a + b) >> 1;
      if (breaks[m]! < x) a = m + 1;
      else b = m;
    }
    return a;
  };
  const elements = breaks.length * 2;
  const cheapest = new Int32Array(elements).fill(-1);
  // paint cheapest first; union-find jumps over painted elements
  const next = new Int32Array(elements + 1);
  for (let e = 0; e <= elements; e++) next[e] = e;
  const find = (e: number): number => {
    let r = e;
    while (next[r] !== r) r = next[r]!;
    let c = e;
    while (next[c] !== r) {
      const n = next[c]!;
      next[c] = r;
      c = n;
    }
    return r;
  };
  const order = keep.map((_, k) => k);
  order.sort((a, b) => {
    const ca = keep[a]!.costMinor!;
    const cb = keep[b]!.costMinor!;
    if (ca !== cb) return ca - cb;
    if (hi[a] !== hi[b]) return hi[b]! - hi[a]!;
    const ia = keep[a]!.id;
    const ib = keep[b]!.id;
    return ia < ib ? -1 : ia > ib ? 1 : 0;
  });
  for (const k of order) {
    const from = 2 * idx(lo[k]!);
    const to = 2 * idx(hi[k]!);
    for (let e = find(from); e <= to; e = find(e)) {
      cheapest[e] = k;
      next[e] = e + 1;
    }
  }
  const n = prepared.fittings.length;
  const prefixV = new Float64Array(n + 1);
  const bad = new Uint8Array(n);
  for (let k = 0; k < n; k++) {
    const f = prepared.fittings[k]!;
    const d = driveAtCurrent(f.ratings, currentA);
    bad[k] = acceptsCurrent(d.status) ? 0 : 1;
    prefixV[k + 1] = prefixV[k]! + d.forwardVoltageV + currentA * f.tailLoopOhm;
  }
  return { currentA, drivers: keep, lo, hi, maxHi: Math.max(...hi), breaks, cheapest, prefixV, bad };
}

function query(g: CurrentGroup, v: number): number {
  const b = g.breaks;
  if (v < b[0]! || v > b[b.length - 1]!) return -1;
  let a = 0;
  let z = b.length - 1;
  while (a < z) {
    const m = (a + z + 1) >> 1;
    if (b[m]! <= v) a = m;
    else z = m - 1;
  }
  return g.cheapest[b[a] === v ? 2 * a : 2 * a + 1]!;
}

interface SegmentWalk {
  groups: CurrentGroup[];
  leadOhm: number;
  prefixLink: Float64Array;
  n: number;
}

/** Call `visit(j, group, driver)` for every string [i, j) some driver accepts, with its cheapest driver per current. */
function walkSegments(w: SegmentWalk, i: number, visit: (j: number, gi: number, k: number) => void): void {
  const { groups, leadOhm, prefixLink, n } = w;
  for (let gi = 0; gi < groups.length; gi++) {
    const g = groups[gi]!;
    const I = g.currentA;
    const pv = g.prefixV;
    const bad = g.bad;
    const fixed = I * leadOhm;
    const pvi = pv[i]!;
    const pli = prefixLink[i]!;
    for (let j = i + 1; j <= n; j++) {
      if (bad[j - 1] === 1) break;
      const vc = pv[j]! - pvi + fixed + I * (prefixLink[j - 1]! - pli);
      if (vc > g.maxHi) break;
      const k = query(g, vc);
      if (k >= 0) visit(j, gi, k);
    }
  }
}

/**
 * Split an ordered run into contiguous strings, each on one driver from the catalogue,
 * minimising the total driver cost. Dynamic programming over the cut points; drivers are
 * grouped by output current and indexed by the compliance-voltage band they accept, so each
 * candidate string costs a binary search. Every chosen string is re-checked in full.
 */
export function splitRun(run: RunToSplit, catalogue: readonly LedDriver[]): SplitResult {
  const n = Array.isArray(run.fittings) ? run.fittings.length : 0;
  const findings: Finding[] = [];
  const empty = (extra: Finding[]): SplitResult => ({
    ok: false,
    strings: [],
    totalCostMinor: null,
    findings: [...findings, ...extra],
    excludedDrivers,
  });
  const excludedDrivers: SplitResult['excludedDrivers'] = [];
  if (!Array.isArray(run.links) || run.links.length !== Math.max(0, n - 1)) {
    return empty([
      finding(
        'run-links-mismatch',
        'error',
        `A run of ${n} fittings needs ${Math.max(0, n - 1)} link cables between them; ${Array.isArray(run.links) ? run.links.length : 0} were given.`,
      ),
    ]);
  }
  // one preparation for the whole run: the lead is runs[0], link k is runs[k + 1]
  const whole: StringLayout = {
    ...segmentLayout(run, 0, n),
    runs: [
      { id: 'lead', role: 'driver-lead', length: run.lead.length, cable: run.lead.cable },
      ...run.links.map((l, k): CableRun => ({ id: `link-${k + 1}`, role: 'link', length: l.length, cable: l.cable })),
    ],
  };
  const prepared = prepareString(whole);
  const blocking = prepared.layoutFindings.filter((f) => BLOCKING_CODES.has(f.code) && f.severity === 'error');
  if (blocking.length > 0) return empty(blocking);

  const leadOhm = prepared.cables[0]!.loopOhm;
  const linkOhm = new Float64Array(Math.max(0, n - 1));
  for (let k = 0; k < n - 1; k++) linkOhm[k] = prepared.cables[k + 1]!.loopOhm;
  const prefixLink = new Float64Array(n);
  for (let k = 0; k < n - 1; k++) prefixLink[k + 1] = prefixLink[k]! + linkOhm[k]!;

  // drivers that can never serve, whatever the string
  const byCurrent = new Map<number, LedDriver[]>();
  const ipCache = new Map<string, Finding[]>();
  for (const d of catalogue) {
    const reasons = checkDriverRecord(d).filter(rejectsDriver);
    if (d.output === 'constant-voltage') {
      reasons.push(
        finding(
          'cc-fitting-on-cv-supply',
          'error',
          `Driver “${d.name ?? d.id}” is a constant-voltage supply; constant-current fittings on it are destroyed.`,
          { subject: 'driver' },
        ),
      );
    }
    const ipKey = d.ipCode ?? '';
    let ip = ipCache.get(ipKey);
    if (!ip) {
      ip = checkIpForLocation(d.ipCode, run.driverLocation, {
        subject: 'driver',
        prefix: 'driver',
        overrides: prepared.ipOverrides,
        what: 'The driver',
      }).filter(rejectsDriver);
      ipCache.set(ipKey, ip);
    }
    reasons.push(...ip);
    if (d.costMinor === undefined || !Number.isFinite(d.costMinor) || d.costMinor < 0) {
      reasons.push(
        finding('driver-price-missing', 'error', `Driver ${d.id} has no price, so it cannot be costed in a split.`, {
          subject: 'driver',
        }),
      );
    }
    if (reasons.length > 0) {
      excludedDrivers.push({ driver: d, reasons });
      continue;
    }
    const list = byCurrent.get(d.currentA);
    if (list) list.push(d);
    else byCurrent.set(d.currentA, [d]);
  }
  const elvMax = elvErrorLimitV(prepared.profile);
  const groups: CurrentGroup[] = [];
  for (const [currentA, ds] of [...byCurrent.entries()].sort((a, b) => a[0] - b[0])) {
    const g = buildGroup(currentA, ds, prepared.marginPct, elvMax, prepared);
    if (g) groups.push(g);
  }

  const segments: SegmentWalk = { groups, leadOhm, prefixLink, n };
  const best = new Float64Array(n + 1).fill(Infinity);
  const fromIdx = new Int32Array(n + 1).fill(-1);
  const groupIdx = new Int32Array(n + 1).fill(-1);
  const driverIdx = new Int32Array(n + 1).fill(-1);
  best[0] = 0;
  for (let i = 0; i < n; i++) {
    const base = best[i]!;
    if (base === Infinity) continue;
    walkSegments(segments, i, (j, gi, k) => {
      const c = base + groups[gi]!.drivers[k]!.costMinor!;
      if (c < best[j]!) {
        best[j] = c;
        fromIdx[j] = i;
        groupIdx[j] = gi;
        driverIdx[j] = k;
      }
    });
  }

  if (best[n] === Infinity) {
    return empty([diagnose(prepared, segments, best, excludedDrivers.length, catalogue.length)]);
  }
  const strings: SplitString[] = [];
  for (let j = n; j > 0; j = fromIdx[j]!) {
    const i = fromIdx[j]!;
    const driver = groups[groupIdx[j]!]!.drivers[driverIdx[j]!]!;
    const result = evaluateDriver(prepareString(segmentLayout(run, i, j)), driver);
    strings.push({ from: i, to: j, driver, costMinor: driver.costMinor!, result });
  }
  strings.reverse();
  for (const s of strings) {
    const why = s.result.findings.filter(rejectsDriver);
    if (why.length > 0) {
      findings.push(
        finding(
          'split-recheck-failed',
          'error',
          `Fittings ${s.from + 1}-${s.to} on ${s.driver.id} failed the full check: ${why[0]!.message}`,
          {
            subject: `string:${s.from + 1}-${s.to}`,
          },
        ),
      );
    }
  }
  return { ok: findings.length === 0, strings, totalCostMinor: best[n]!, findings, excludedDrivers };
}

function diagnose(
  prepared: PreparedString,
  w: SegmentWalk,
  best: Float64Array,
  excluded: number,
  catalogueSize: number,
): Finding {
  const { groups, leadOhm, n } = w;
  if (groups.length === 0) {
    return finding(
      'split-impossible',
      'error',
      `No driver in the catalogue can be used here (${excluded} of ${catalogueSize} ruled out: constant-voltage output, IP code short of the location, no price or no window, and none left with room for the firm's headroom margin).`,
      { subject: 'catalogue' },
    );
  }
  const name = (k: number): string => {
    const f = prepared.fittings[k]!;
    return `fitting ${k + 1}${f.id ? ` (${f.id})` : ''}`;
  };
  const mA = (a: number): string => `${r2(a * 1000, 1)} mA`;
  // 1. a fitting no usable driver's current suits
  for (let k = 0; k < n; k++) {
    if (groups.every((g) => g.bad[k] === 1)) {
      const rated = prepared.fittings[k]!.ratings.map((r) => mA(r.currentA)).join(' / ');
      return finding(
        'split-impossible',
        'error',
        `No usable driver runs at a current ${name(k)} is rated for (${rated}); the catalogue offers ${groups.map((g) => mA(g.currentA)).join(', ')}.`,
        { subject: `fitting:${k + 1}` },
      );
    }
  }
  // 2. a fitting too much for any driver even on its own
  for (let k = 0; k < n; k++) {
    const parts: string[] = [];
    let tooHigh = true;
    for (const g of groups) {
      if (g.bad[k] === 1) continue;
      const alone = g.prefixV[k + 1]! - g.prefixV[k]! + g.currentA * leadOhm;
      if (alone <= g.maxHi) tooHigh = false;
      parts.push(
        `at ${mA(g.currentA)} it needs ${r2(alone)} V with its lead, the most any driver gives within the firm's margin is ${r2(g.maxHi)} V`,
      );
    }
    if (tooHigh) {
      return finding('split-impossible', 'error', `Even alone, ${name(k)} is too much for any driver: ${parts.join('; ')}.`, {
        subject: `fitting:${k + 1}`,
      });
    }
  }
  // 3. a fitting that no acceptable string contains
  let farthest = 0;
  for (let i = 0; i < n; i++) {
    walkSegments(w, i, (j) => {
      if (j > farthest) farthest = j;
    });
    if (farthest <= i) {
      return finding(
        'split-impossible',
        'error',
        `No string that includes ${name(i)} lands inside any driver's window with the firm's headroom margin: with its neighbours it is too little for the minimums or too much for the maximums.`,
        { subject: `fitting:${i + 1}` },
      );
    }
  }
  // 4. every fitting fits somewhere, but the pieces do not join up
  let reach = 0;
  for (let i = 0; i < n; i++) if (best[i] !== Infinity) reach = i;
  return finding(
    'split-impossible',
    'error',
    `The run can be split up to fitting ${reach}, but no string starting at ${name(reach)} fits a driver; try other cut points by moving fittings between runs or adding a driver with a lower minimum.`,
    { subject: `fitting:${reach + 1}` },
  );
}
