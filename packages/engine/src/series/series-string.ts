import { conductorBase, resistanceAtTemperatureOhmPerKm, type CableSpec } from '../cables/cable-spec';
import { finding, hasErrors, type Finding } from '../findings';
import { checkIpForLocation, type IpOverrides } from '../ip-code/installation-location';
import { codeProfile, type CodeProfile } from '../profiles/code-profile';
import { isEngineInputError } from '../units/engine-input-error';
import { lengthInMetres, type Length } from '../units/length';
import { roundForDisplay as r2 } from '../units/round';
import { driveAtCurrent, resolveRatings, type ResolvedRating } from './fitting-drive';
import type {
  CableAtCurrent,
  CableRole,
  FittingAtCurrent,
  LedDriver,
  SeriesStringInput,
  SeriesStringResult,
  StringLayout,
} from './series-types';

/** Default headroom below the driver's maximum, % (common practice: 10-20 %). */
export const DEFAULT_HEADROOM_MARGIN_PCT = 10;
/** Efficiency assumed when the driver's datasheet gives none (low end of the 85-92 % common range). */
export const ASSUMED_DRIVER_EFFICIENCY = 0.85;
/** Voltage comparisons allow this much floating-point slack, V. */
export const VOLTAGE_EPSILON_V = 1e-9;

interface PreparedFitting {
  index: number;
  id?: string;
  subject: string;
  constantVoltage: boolean;
  ratings: ResolvedRating[];
  tailLoopOhm: number;
}

interface PreparedCable {
  subject: string;
  role: CableRole;
  lengthM: number;
  loopOhm: number;
}

/** Per-current figures shared by every driver at that current. */
export interface StringAtCurrent {
  currentA: number;
  forwardVoltageV: number;
  lumens: number | null;
  fittings: FittingAtCurrent[];
  cables: CableAtCurrent[];
  /** Current-mismatch findings (above rating: error; below: warning; between: info). */
  findings: Finding[];
  /** The mismatch findings that rule a driver at this current out (above or below a rating). */
  rejecting: Finding[];
  /** Largest per-fitting voltage (Vf plus its tail's drop), V, and whether all are alike. */
  perFittingMaxV: number;
  uniform: boolean;
}

/** A string layout checked once; evaluate it against many drivers cheaply. */
export interface PreparedString {
  profile: CodeProfile;
  marginPct: number;
  temperatureC: number;
  ipOverrides: IpOverrides;
  layout: StringLayout;
  fittings: PreparedFitting[];
  cables: PreparedCable[];
  runsLoopOhm: number;
  tailsLoopOhm: number;
  layoutFindings: Finding[];
  cache: Map<number, StringAtCurrent>;
  /** Driver IP findings by IP code text, at this layout's driver location. */
  driverIpCache: Map<string, Finding[]>;
}

function loopOhm(
  length: Length,
  cable: CableSpec,
  temperatureC: number,
  subject: string,
  findings: Finding[],
): { lengthM: number; loopOhm: number } {
  try {
    const lengthM = lengthInMetres(length, subject);
    const perM = resistanceAtTemperatureOhmPerKm(conductorBase(cable, subject), temperatureC) / 1000;
    return { lengthM, loopOhm: 2 * lengthM * perM };
  } catch (e) {
    if (!isEngineInputError(e)) throw e;
    findings.push({ ...e.finding, subject });
    return { lengthM: 0, loopOhm: 0 };
  }
}

/** IP code and location pairs whose check came back without findings. */
class CleanIpPairs {
  private readonly byLocation = new Map<string, Set<string>>();

  has(ipCode: unknown, location: unknown): boolean {
    return typeof ipCode === 'string' && typeof location === 'string' && this.byLocation.get(location)?.has(ipCode) === true;
  }

  add(ipCode: unknown, location: unknown): void {
    if (typeof ipCode !== 'string' || typeof location !== 'string') return;
    let codes = this.byLocation.get(location);
    if (!codes) {
      codes = new Set();
      this.byLocation.set(location, codes);
    }
    codes.add(ipCode);
  }
}

function fittingName(index: number, id?: string): string {
  return id ? `Fitting ${index + 1} (${id})` : `Fitting ${index + 1}`;
}

/** Check everything that does not depend on the driver: ratings, cables, fitting IP codes. */
export function prepareString(layout: StringLayout): PreparedString {
  const profile = codeProfile(layout.profile);
  const layoutFindings: Finding[] = [];
  let marginPct = layout.firm?.headroomMarginPct ?? DEFAULT_HEADROOM_MARGIN_PCT;
  if (!Number.isFinite(marginPct) || marginPct < 0 || marginPct >= 100) {
    layoutFindings.push(
      finding(
        'headroom-margin-invalid',
        'warning',
        `The firm's headroom margin must be 0-99 %; using ${DEFAULT_HEADROOM_MARGIN_PCT} %.`,
      ),
    );
    marginPct = DEFAULT_HEADROOM_MARGIN_PCT;
  }
  let temperatureC = layout.temperatureC ?? profile.dropWorkingTemperatureC;
  if (!Number.isFinite(temperatureC) || temperatureC < -50 || temperatureC > 200) {
    layoutFindings.push(
      finding(
        'cable-temperature-invalid',
        'warning',
        `A conductor temperature must be -50 to 200 °C; using ${profile.dropWorkingTemperatureC} °C.`,
      ),
    );
    temperatureC = profile.dropWorkingTemperatureC;
  }
  const ipOverrides = layout.firm?.ipOverrides ?? {};
  const rawFittings = Array.isArray(layout.fittings) ? layout.fittings : [];
  if (rawFittings.length === 0) {
    layoutFindings.push(finding('string-empty', 'error', 'The string has no fittings.', { subject: 'string' }));
  }
  // Fittings in a string mostly share one IP code and location: a pair found clean once is
  // clean for every fitting (the subject and name only appear in findings), so each pair is
  // parsed and checked once instead of once per fitting.
  const ipClean = new CleanIpPairs();
  const fittings: PreparedFitting[] = rawFittings.map((f, index) => {
    const subject = `fitting:${index + 1}`;
    const what = fittingName(index, f.id);
    const { ratings, findings } = resolveRatings(f, subject, what);
    layoutFindings.push(...findings);
    const constantVoltage = f.drive === 'constant-voltage';
    if (constantVoltage) {
      layoutFindings.push(
        finding(
          'cv-fitting-on-cc-driver',
          'error',
          `${what} is a constant-voltage fitting; on a constant-current string it will not work and may be damaged. Put it on a constant-voltage supply.`,
          { subject },
        ),
      );
    }
    if (!ipClean.has(f.ipCode, f.location)) {
      const ip = checkIpForLocation(f.ipCode, f.location, { subject, prefix: 'fitting', overrides: ipOverrides, what });
      if (ip.length === 0) ipClean.add(f.ipCode, f.location);
      else layoutFindings.push(...ip);
    }
    const tail = f.tail
      ? loopOhm(f.tail.length, f.tail.cable, temperatureC, `${subject}/tail`, layoutFindings)
      : { lengthM: 0, loopOhm: 0 };
    return f.id === undefined
      ? { index, subject, constantVoltage, ratings, tailLoopOhm: tail.loopOhm }
      : { index, id: f.id, subject, constantVoltage, ratings, tailLoopOhm: tail.loopOhm };
  });
  const runs = Array.isArray(layout.runs) ? layout.runs : [];
  const cables: PreparedCable[] = runs.map((run, k) => {
    const subject = `cable:${run.id ?? `${run.role}-${k + 1}`}`;
    const { lengthM, loopOhm: lo } = loopOhm(run.length, run.cable, temperatureC, subject, layoutFindings);
    return { subject, role: run.role, lengthM, loopOhm: lo };
  });
  let runsLoopOhm = 0;
  for (const c of cables) runsLoopOhm += c.loopOhm;
  let tailsLoopOhm = 0;
  for (const f of fittings) tailsLoopOhm += f.tailLoopOhm;
  return {
    profile,
    marginPct,
    temperatureC,
    ipOverrides,
    layout,
    fittings,
    cables,
    runsLoopOhm,
    tailsLoopOhm,
    layoutFindings,
    cache: new Map(),
    driverIpCache: new Map(),
  };
}

/** Forward voltages, light and current-mismatch findings at one drive current (cached). */
export function stringAtCurrent(prepared: PreparedString, currentA: number): StringAtCurrent {
  const hit = prepared.cache.get(currentA);
  if (hit) return hit;
  const findings: Finding[] = [];
  let forwardVoltageV = 0;
  let lumens: number | null = 0;
  let perFittingMaxV = 0;
  let firstV: number | null = null;
  let uniform = true;
  const fittings: FittingAtCurrent[] = prepared.fittings.map((f) => {
    const d = driveAtCurrent(f.ratings, currentA);
    // names and rated currents are written out only for a fitting that gets a finding
    if (d.status === 'above-rating' || d.status === 'below-rating' || d.status === 'between-ratings') {
      const what = fittingName(f.index, f.id);
      const rated = f.ratings.map((r) => `${r2(r.currentA * 1000, 1)} mA`).join(' / ');
      const values = { driveCurrentA: currentA, ratedCurrentsA: f.ratings.map((r) => r.currentA).join(',') };
      if (d.status === 'above-rating') {
        findings.push(
          finding(
            'current-above-rating',
            'error',
            `${what} is rated ${rated}; the driver's ${r2(currentA * 1000, 1)} mA will overdrive and destroy it.`,
            { subject: f.subject, values },
          ),
        );
      } else if (d.status === 'below-rating') {
        findings.push(
          finding(
            'current-below-rating',
            'warning',
            `${what} is rated ${rated}; at the driver's ${r2(currentA * 1000, 1)} mA it runs dimmer than designed.`,
            { subject: f.subject, values },
          ),
        );
      } else if (d.status === 'between-ratings') {
        findings.push(
          finding(
            'current-between-ratings',
            'info',
            `${what} is rated ${rated}; at ${r2(currentA * 1000, 1)} mA its forward voltage and light are interpolated.`,
            { subject: f.subject, values },
          ),
        );
      }
    }
    const vf = d.forwardVoltageV;
    forwardVoltageV += vf;
    if (lumens !== null) lumens = d.lumens === null ? null : lumens + d.lumens;
    const tailDropV = currentA * f.tailLoopOhm;
    const v = vf + tailDropV;
    if (firstV === null) firstV = v;
    else if (Math.abs(v - firstV) > 1e-9) uniform = false;
    if (v > perFittingMaxV) perFittingMaxV = v;
    // two literals rather than a spread, so the record has the same keys in the same order
    // without a temporary object per fitting
    return f.id === undefined
      ? {
          index: f.index,
          status: d.status,
          forwardVoltageV: vf,
          powerW: vf * currentA,
          lumens: d.lumens,
          tailLoopResistanceOhm: f.tailLoopOhm,
          tailDropV,
        }
      : {
          index: f.index,
          id: f.id,
          status: d.status,
          forwardVoltageV: vf,
          powerW: vf * currentA,
          lumens: d.lumens,
          tailLoopResistanceOhm: f.tailLoopOhm,
          tailDropV,
        };
  });
  const cables: CableAtCurrent[] = prepared.cables.map((c) => ({
    subject: c.subject,
    role: c.role,
    lengthM: c.lengthM,
    loopResistanceOhm: c.loopOhm,
    dropV: currentA * c.loopOhm,
    lossW: currentA * currentA * c.loopOhm,
  }));
  const out: StringAtCurrent = {
    currentA,
    forwardVoltageV,
    lumens: prepared.fittings.length === 0 ? null : lumens,
    fittings,
    cables,
    findings,
    rejecting: findings.filter((f) => f.code === 'current-above-rating' || f.code === 'current-below-rating'),
    perFittingMaxV,
    uniform,
  };
  prepared.cache.set(currentA, out);
  return out;
}

/** The driver's effective limits at its current: voltage window and power bounds. */
export interface DriverLimits {
  voltageMinV: number | null;
  voltageMaxV: number | null;
  powerMinW: number | null;
  powerMaxW: number | null;
}

/** The tighter of the power window's top and the stated maximum power, W; null when neither. */
function powerMaxOf(driver: LedDriver): number | null {
  const a = driver.powerWindowW?.maxW;
  const b = driver.maxPowerW;
  if (a === undefined) return b === undefined ? null : b;
  return b === undefined ? a : Math.min(a, b);
}

export function driverLimits(driver: LedDriver): DriverLimits {
  const vw = driver.voltageWindowV;
  const pw = driver.powerWindowW;
  return {
    voltageMinV: vw ? vw.minV : null,
    voltageMaxV: vw ? vw.maxV : null,
    powerMinW: pw ? pw.minW : null,
    powerMaxW: powerMaxOf(driver),
  };
}

const NO_FINDINGS: readonly Finding[] = Object.freeze([]);

function addInvalid(out: Finding[] | null, driver: LedDriver, msg: string): Finding[] {
  const list = out ?? [];
  list.push(finding('driver-invalid', 'error', `Driver ${driver?.id ?? '?'}: ${msg}`, { subject: 'driver' }));
  return list;
}

/**
 * Problems with the driver record itself (independent of any string); every one is an
 * error. A sound record allocates nothing (the shared empty list comes back).
 */
export function checkDriverRecord(driver: LedDriver): readonly Finding[] {
  if (driver === null || typeof driver !== 'object') return addInvalid(null, driver, 'no driver given.');
  let out: Finding[] | null = null;
  if (driver.output !== 'constant-current' && driver.output !== 'constant-voltage') {
    out = addInvalid(out, driver, 'output must be constant-current or constant-voltage.');
  }
  if (driver.output === 'constant-current' && (!Number.isFinite(driver.currentA) || driver.currentA <= 0)) {
    out = addInvalid(out, driver, 'the output current must be a positive number of amps.');
  }
  const vw = driver.voltageWindowV;
  if (vw && !(Number.isFinite(vw.minV) && Number.isFinite(vw.maxV) && vw.minV >= 0 && vw.maxV > vw.minV)) {
    out = addInvalid(out, driver, 'the voltage window needs a minimum below its maximum.');
  }
  const pw = driver.powerWindowW;
  if (pw && !(Number.isFinite(pw.minW) && Number.isFinite(pw.maxW) && pw.minW >= 0 && pw.maxW > pw.minW)) {
    out = addInvalid(out, driver, 'the power window needs a minimum below its maximum.');
  }
  if (driver.maxPowerW !== undefined && !(Number.isFinite(driver.maxPowerW) && driver.maxPowerW > 0)) {
    out = addInvalid(out, driver, 'maximum power must be positive.');
  }
  if (
    driver.efficiency !== undefined &&
    !(Number.isFinite(driver.efficiency) && driver.efficiency > 0 && driver.efficiency <= 1)
  ) {
    out = addInvalid(out, driver, 'efficiency must be between 0 and 1 (e.g. 0.88).');
  }
  if (driver.output === 'constant-current' && !vw && !pw) {
    out ??= [];
    out.push(
      finding(
        'driver-window-missing',
        'error',
        `Driver ${driver.id}: no output voltage or power window is known, so it cannot be checked.`,
        {
          subject: 'driver',
        },
      ),
    );
  }
  return out ?? NO_FINDINGS;
}

/** Evaluate a prepared layout on one driver. */
export function evaluateDriver(prepared: PreparedString, driver: LedDriver): SeriesStringResult {
  return assembleResult(prepared, evaluateDriverParts(prepared, driver));
}

export interface DriverEvaluation {
  /** The result with `findings` and `ok` not yet filled in (assembleResult does it). */
  figures: SeriesStringResult;
  /** Findings that belong to this driver, apart from the layout's and the current's shared ones. */
  own: Finding[];
  atCurrent: StringAtCurrent;
  cvSupply: boolean;
}

/** The full result: layout findings, then current-mismatch findings, then the driver's own. */
export function assembleResult(prepared: PreparedString, e: DriverEvaluation): SeriesStringResult {
  const findings = prepared.layoutFindings.concat(e.cvSupply ? [] : e.atCurrent.findings, e.own);
  const result = e.figures;
  result.findings = findings;
  result.ok = !hasErrors(findings);
  return result;
}

/** Driver IP findings at the layout's driver location, worked out once per IP code text. */
export function driverIpFindings(prepared: PreparedString, ipCode: string | undefined): Finding[] {
  const key = ipCode ?? '';
  let hit = prepared.driverIpCache.get(key);
  if (!hit) {
    hit = checkIpForLocation(ipCode, prepared.layout.driverLocation, {
      subject: 'driver',
      prefix: 'driver',
      overrides: prepared.ipOverrides,
      what: 'The driver',
    });
    prepared.driverIpCache.set(key, hit);
  }
  return hit;
}

/** Verdict bits of `DriverCore.verdicts`: which limit checks a driver fails. */
export const VERDICT = {
  voltageBelowWindow: 1,
  voltageAboveWindow: 2,
  powerBelowWindow: 4,
  powerAboveWindow: 8,
  headroomBelowMargin: 16,
} as const;
/** The code profile's k-th ELV limit exceeded sets bit `VERDICT_ELV_BASE << k`. */
export const VERDICT_ELV_BASE = 32;

/**
 * Every number behind the verdicts on one driver, without findings or messages. The
 * evaluation writes its findings from these; driver choice screens whole catalogues with
 * one reused record (no allocation per driver).
 */
export interface DriverCore {
  /** The record has no `driver-invalid` / `driver-window-missing` problem and is not a constant-voltage supply. */
  recordOk: boolean;
  cvSupply: boolean;
  currentA: number;
  at: StringAtCurrent;
  cableLoopResistanceOhm: number;
  cableDropV: number;
  complianceVoltageV: number;
  outputPowerW: number;
  voltageMinV: number | null;
  voltageMaxV: number | null;
  powerMinW: number | null;
  powerMaxW: number | null;
  /** Fraction of the nearer maximum (voltage or power) used; null when none is known. */
  loading: number | null;
  /** The driver's usable maximum output at this current, W. */
  upperW: number | null;
  /** VERDICT bits. */
  verdicts: number;
}

/**
 * Work out a driver's figures and verdicts on a prepared layout: into `core` when given (a
 * record reused over a catalogue), else into a new record.
 */
export function fillDriverCore(prepared: PreparedString, driver: LedDriver, core?: DriverCore): DriverCore {
  const cvSupply = driver?.output === 'constant-voltage';
  const recordOk = checkDriverRecord(driver).length === 0 && !cvSupply;
  const fallbackA = prepared.fittings[0]?.ratings[0]?.currentA ?? 0;
  const currentA = !cvSupply && Number.isFinite(driver?.currentA) && driver.currentA > 0 ? driver.currentA : fallbackA;
  const at = stringAtCurrent(prepared, currentA);
  const cableLoopResistanceOhm = prepared.runsLoopOhm + prepared.tailsLoopOhm;
  const cableDropV = currentA * cableLoopResistanceOhm;
  const complianceVoltageV = at.forwardVoltageV + cableDropV;
  const outputPowerW = complianceVoltageV * currentA;
  const vw = recordOk ? driver.voltageWindowV : undefined;
  const voltageMinV = vw ? vw.minV : null;
  const voltageMaxV = vw ? vw.maxV : null;
  const powerMinW = recordOk && driver.powerWindowW ? driver.powerWindowW.minW : null;
  const powerMaxW = recordOk ? powerMaxOf(driver) : null;

  let verdicts = 0;
  if (recordOk && !cvSupply) {
    if (voltageMinV !== null && complianceVoltageV < voltageMinV - VOLTAGE_EPSILON_V) verdicts |= VERDICT.voltageBelowWindow;
    if (voltageMaxV !== null && complianceVoltageV > voltageMaxV + VOLTAGE_EPSILON_V) verdicts |= VERDICT.voltageAboveWindow;
    if (powerMinW !== null && outputPowerW < powerMinW * (1 - 1e-12) - 1e-12) verdicts |= VERDICT.powerBelowWindow;
    if (powerMaxW !== null && outputPowerW > powerMaxW * (1 + 1e-12) + 1e-12) verdicts |= VERDICT.powerAboveWindow;
  }
  // headroom: the nearer of voltage and power to the driver's maximum
  let loading: number | null = null;
  if (!cvSupply && (voltageMaxV !== null || powerMaxW !== null)) {
    const byV = voltageMaxV !== null ? complianceVoltageV / voltageMaxV : 0;
    const byP = powerMaxW !== null ? outputPowerW / powerMaxW : 0;
    loading = Math.max(byV, byP);
  }
  if (loading !== null && loading <= 1 + 1e-12 && loading > 1 - prepared.marginPct / 100 + 1e-12)
    verdicts |= VERDICT.headroomBelowMargin;
  const limits = prepared.profile.elvLimits;
  for (let k = 0; k < limits.length; k++) {
    if (complianceVoltageV > limits[k]!.dcMaxV + VOLTAGE_EPSILON_V) verdicts |= VERDICT_ELV_BASE << k;
  }
  const upperW =
    voltageMaxV !== null && powerMaxW !== null
      ? Math.min(voltageMaxV * currentA, powerMaxW)
      : voltageMaxV !== null
        ? voltageMaxV * currentA
        : powerMaxW;
  if (core === undefined) {
    return {
      recordOk,
      cvSupply,
      currentA,
      at,
      cableLoopResistanceOhm,
      cableDropV,
      complianceVoltageV,
      outputPowerW,
      voltageMinV,
      voltageMaxV,
      powerMinW,
      powerMaxW,
      loading,
      upperW,
      verdicts,
    };
  }
  core.recordOk = recordOk;
  core.cvSupply = cvSupply;
  core.currentA = currentA;
  core.at = at;
  core.cableLoopResistanceOhm = cableLoopResistanceOhm;
  core.cableDropV = cableDropV;
  core.complianceVoltageV = complianceVoltageV;
  core.outputPowerW = outputPowerW;
  core.voltageMinV = voltageMinV;
  core.voltageMaxV = voltageMaxV;
  core.powerMinW = powerMinW;
  core.powerMaxW = powerMaxW;
  core.loading = loading;
  core.upperW = upperW;
  core.verdicts = verdicts;
  return core;
}

/** Headroom below the driver's maximum, % (null when no maximum is known). */
export function headroomPctOf(core: DriverCore): number | null {
  return core.loading === null ? null : (1 - core.loading) * 100;
}

/**
 * Evaluate and also return the findings that belong to this driver (`own`) apart from the
 * layout's and the current's shared ones, so driver choice can sift many drivers quickly.
 */
export function evaluateDriverParts(prepared: PreparedString, driver: LedDriver): DriverEvaluation {
  const core = fillDriverCore(prepared, driver);
  const findings: Finding[] = [...checkDriverRecord(driver)];
  // People know a driver by its name; the id is only a fallback for records without one.
  const named = driver?.name ? ` “${driver.name}”` : driver?.id ? ` (${driver.id})` : '';
  const driverWhat = `The driver${named}`;
  const driverInText = `the driver${named}`;
  const {
    cvSupply,
    currentA,
    at,
    cableLoopResistanceOhm,
    cableDropV,
    complianceVoltageV,
    outputPowerW,
    verdicts,
    loading,
    upperW,
  } = core;
  if (cvSupply) {
    findings.push(
      finding(
        'cc-fitting-on-cv-supply',
        'error',
        `${driverWhat} is a constant-voltage supply; constant-current fittings on it are destroyed. Use a constant-current driver at the fittings' rated current.`,
        { subject: 'driver' },
      ),
    );
  }
  findings.push(...driverIpFindings(prepared, driver?.ipCode));

  const fittingsPowerW = at.forwardVoltageV * currentA;
  const cableLossW = currentA * cableDropV;
  let efficiency = driver?.efficiency ?? ASSUMED_DRIVER_EFFICIENCY;
  if (!(efficiency > 0 && efficiency <= 1)) efficiency = ASSUMED_DRIVER_EFFICIENCY;
  if (driver?.efficiency === undefined) {
    findings.push(
      finding(
        'efficiency-assumed',
        'info',
        `${driverWhat} has no stated efficiency; input power assumes ${ASSUMED_DRIVER_EFFICIENCY * 100} %.`,
        {
          subject: 'driver',
        },
      ),
    );
  }
  const inputPowerW = outputPowerW / efficiency;

  const values = { complianceVoltageV: r2(complianceVoltageV, 3), outputPowerW: r2(outputPowerW, 3) };
  if (verdicts & VERDICT.voltageBelowWindow) {
    findings.push(
      finding(
        'voltage-below-window',
        'error',
        `The string needs ${r2(complianceVoltageV)} V but ${driverInText} regulates only from ${core.voltageMinV} V: the fittings may not light or will flicker. Add fittings or choose a driver with a lower window.`,
        { subject: 'driver', values: { ...values, windowMinV: core.voltageMinV! } },
      ),
    );
  }
  if (verdicts & VERDICT.voltageAboveWindow) {
    findings.push(
      finding(
        'voltage-above-window',
        'error',
        `The string needs ${r2(complianceVoltageV)} V but ${driverInText} reaches only ${core.voltageMaxV} V: it cannot hold the current and the fittings run dim or flicker. Split the string or choose a higher-voltage driver.`,
        { subject: 'driver', values: { ...values, windowMaxV: core.voltageMaxV! } },
      ),
    );
  }
  if (verdicts & VERDICT.powerBelowWindow) {
    findings.push(
      finding(
        'power-below-window',
        'error',
        `The string draws ${r2(outputPowerW)} W, below ${driverInText}'s minimum of ${core.powerMinW} W.`,
        { subject: 'driver', values: { ...values, windowMinW: core.powerMinW! } },
      ),
    );
  }
  if (verdicts & VERDICT.powerAboveWindow) {
    findings.push(
      finding(
        'power-above-window',
        'error',
        `The string draws ${r2(outputPowerW)} W, above ${driverInText}'s maximum of ${core.powerMaxW} W.`,
        { subject: 'driver', values: { ...values, maxW: core.powerMaxW! } },
      ),
    );
  }

  const loadingPct = loading === null ? null : loading * 100;
  const headroomPct = headroomPctOf(core);
  const headroomW = upperW === null || cvSupply ? null : upperW - outputPowerW;
  if (verdicts & VERDICT.headroomBelowMargin) {
    const l = loading!;
    findings.push(
      finding(
        'headroom-below-margin',
        'warning',
        `${driverWhat} runs at ${r2(l * 100, 1)} % of its maximum, leaving ${r2((1 - l) * 100, 1)} % headroom, under the firm's ${prepared.marginPct} %.`,
        { subject: 'driver', values: { loadingPct: r2(l * 100, 2), marginPct: prepared.marginPct } },
      ),
    );
  }
  let powerWindowPositionPct: number | null = null;
  if (!cvSupply && core.powerMinW !== null && core.powerMaxW !== null && core.powerMaxW > core.powerMinW) {
    powerWindowPositionPct = ((outputPowerW - core.powerMinW) / (core.powerMaxW - core.powerMinW)) * 100;
  } else if (!cvSupply && core.voltageMinV !== null && core.voltageMaxV !== null) {
    powerWindowPositionPct = ((complianceVoltageV - core.voltageMinV) / (core.voltageMaxV - core.voltageMinV)) * 100;
  }

  const limits = prepared.profile.elvLimits;
  for (let k = 0; k < limits.length; k++) {
    if (!(verdicts & (VERDICT_ELV_BASE << k))) continue;
    const limit = limits[k]!;
    findings.push(
      finding(
        limit.code,
        limit.severity,
        `The string needs ${r2(complianceVoltageV)} V DC, above ${limit.dcMaxV} V DC (${limit.citation}): ${limit.consequence}`,
        { subject: 'string', values: { complianceVoltageV: r2(complianceVoltageV, 3), limitV: limit.dcMaxV } },
      ),
    );
  }

  // the largest number of these fittings the driver can take
  let maxFittings: number | null = null;
  let maxFittingsWithinMargin: number | null = null;
  let maxFittingsBasis: SeriesStringResult['maxFittingsBasis'] = null;
  const upperV = upperW === null || currentA <= 0 ? null : upperW / currentA;
  if (!cvSupply && upperV !== null && at.perFittingMaxV > 0) {
    const fixedV = currentA * prepared.runsLoopOhm;
    const per = at.perFittingMaxV;
    maxFittings = Math.max(0, Math.floor((upperV - fixedV + VOLTAGE_EPSILON_V) / per));
    maxFittingsWithinMargin = Math.max(
      0,
      Math.floor((upperV * (1 - prepared.marginPct / 100) - fixedV + VOLTAGE_EPSILON_V) / per),
    );
    maxFittingsBasis = at.uniform ? 'uniform' : 'largest-fitting';
  }

  const figures: DriverEvaluation['figures'] = {
    driverId: driver?.id ?? '',
    currentA,
    fittingCount: prepared.fittings.length,
    stringForwardVoltageV: at.forwardVoltageV,
    cableLoopResistanceOhm,
    cableDropV,
    complianceVoltageV,
    fittingsPowerW,
    cableLossW,
    outputPowerW,
    efficiency,
    inputPowerW,
    loadingPct,
    powerWindowPositionPct,
    headroomPct,
    headroomW,
    lumens: at.lumens,
    maxFittings,
    maxFittingsWithinMargin,
    maxFittingsBasis,
    fittings: at.fittings,
    cables: at.cables,
    findings: [],
    ok: false,
  };
  return { figures, own: findings, atCurrent: at, cvSupply };
}

/**
 * Check a constant-current series string on its driver: voltages, cable drop and loss,
 * power, headroom, the most fittings it can take, and every finding. Never throws on bad
 * input; problems come back as findings.
 */
export function checkSeriesString(input: SeriesStringInput): SeriesStringResult {
  return evaluateDriver(prepareString(input), input.driver);
}
