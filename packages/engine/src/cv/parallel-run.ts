/**
 * Constant-voltage (12/24 V) parallel runs: the voltage at every fitting, the worst one,
 * supply loading, cable losses, and the smallest stocked cable that keeps every fitting
 * within the drop limit and its own minimum. A design aid: the mains side of the supply,
 * its protection and certification follow local wiring rules and a licensed electrician.
 *
 * Load model: each fitting draws its rated current I = P / V_rated (the usual design
 * figure; a fitting with its own regulator draws a little more as its voltage falls).
 * Two-core cable, R_loop = 2 · length · R per metre at the working temperature.
 * - daisy chain: segment j carries every load beyond it; V_k = V_s − Σ_{j<=k} I_seg,j · R_loop,j
 * - home run: V_k = V_s − I_k · R_loop,k
 * - hub: V_junction = V_s − I_total · R_loop,feeder; V_k = V_junction − I_k · R_loop,spoke k
 * Drop % is measured from the supply's nominal voltage.
 */
import { conductorBase, conductorResistanceOhmPerM, describeCable, type CableSpec } from '../cables/cable-spec';
import { finding, type Finding } from '../findings';
import { checkIpForLocation, type IpOverrides } from '../ip-code/installation-location';
import { codeProfile, elvLimitsExceeded, isCodeProfileId, type CodeProfile } from '../profiles/code-profile';
import { isEngineInputError } from '../units/engine-input-error';
import { lengthInMetres } from '../units/length';
import { listOf, shown } from '../takeoff/input-guards';
import { roundForDisplay } from '../units/round';
import type {
  CvCableChoice,
  CvFirmSettings,
  CvFittingResult,
  CvInput,
  CvLayout,
  CvResult,
  CvRun,
  CvRunResult,
  CvWorst,
} from './cv-types';

export const DEFAULT_CV_DROP_LIMIT_PCT = 5;
/** Supply loading for constant-voltage systems: at most about 80 % of rated power (common practice). */
export const DEFAULT_SUPPLY_LOADING_LIMIT_PCT = 80;
/** Comparisons allow this much rounding noise, V or %. */
const EPS = 1e-9;

/** A run reduced to numbers: what the cable choice re-evaluates with other cables. */
export interface PreparedCvRun {
  id: string;
  layout: CvLayout;
  lengthsM: number[];
  currentsA: number[];
  minVoltagesV: (number | null)[];
  fittingIds: string[];
  feederLengthM: number;
  totalCurrentA: number;
}

export interface CvRunVoltages {
  voltagesV: number[];
  lossW: number;
}

/**
 * Voltages at each fitting and the cable loss, for given conductor resistances (ohm/m).
 * `into`, when given, is filled and returned as `voltagesV` (a scratch array reused while
 * trying cables, so each try allocates no list of its own).
 */
export function runVoltages(
  run: PreparedCvRun,
  supplyV: number,
  spanOhmPerM: number,
  feederOhmPerM = spanOhmPerM,
  into?: number[],
): CvRunVoltages {
  const n = run.currentsA.length;
  const voltagesV = into ?? new Array<number>(n);
  if (voltagesV.length !== n) voltagesV.length = n;
  let lossW = 0;
  if (run.layout === 'daisy-chain') {
    let carried = run.totalCurrentA;
    let v = supplyV;
    for (let j = 0; j < n; j++) {
      const r = 2 * run.lengthsM[j]! * spanOhmPerM;
      v -= carried * r;
      lossW += carried * carried * r;
      voltagesV[j] = v;
      carried -= run.currentsA[j]!;
      if (carried < 0) carried = 0; // rounding noise on the last segment
    }
  } else {
    let start = supplyV;
    if (run.layout === 'hub') {
      const rf = 2 * run.feederLengthM * feederOhmPerM;
      start -= run.totalCurrentA * rf;
      lossW += run.totalCurrentA * run.totalCurrentA * rf;
    }
    for (let k = 0; k < n; k++) {
      const i = run.currentsA[k]!;
      const r = 2 * run.lengthsM[k]! * spanOhmPerM;
      voltagesV[k] = start - i * r;
      lossW += i * i * r;
    }
  }
  return { voltagesV, lossW };
}

/** Does every fitting stay within the drop limit and above its own minimum? Also the worst. */
function judge(run: PreparedCvRun, v: CvRunVoltages, supplyV: number, limitPct: number): { ok: boolean; worstIndex: number } {
  let ok = true;
  let worstIndex = -1;
  let worstV = Infinity;
  for (let k = 0; k < v.voltagesV.length; k++) {
    const volts = v.voltagesV[k]!;
    const dropPct = ((supplyV - volts) / supplyV) * 100;
    const min = run.minVoltagesV[k];
    if (dropPct > limitPct + EPS || (min !== null && min !== undefined && volts < min - EPS)) ok = false;
    if (volts < worstV) {
      worstV = volts;
      worstIndex = k;
    }
  }
  return { ok, worstIndex };
}

const isPositive = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;
const isNonNegative = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x >= 0;

function cableOhmPerM(spec: CableSpec, temperatureC: number, subject: string, findings: Finding[]): number | null {
  try {
    return conductorResistanceOhmPerM(spec, temperatureC);
  } catch (e) {
    if (isEngineInputError(e)) {
      findings.push({ ...e.finding, subject: e.finding.subject ?? subject });
      return null;
    }
    throw e;
  }
}

/** Check a constant-voltage supply and its parallel runs. Never throws for bad data: it reports findings. */
export function checkCvRuns(input: CvInput): CvResult {
  const findings: Finding[] = [];
  let profile: CodeProfile;
  if (
    isCodeProfileId(input.profile) ||
    (typeof input.profile === 'object' && input.profile !== null && Array.isArray(input.profile.elvLimits))
  ) {
    profile = codeProfile(input.profile);
  } else {
    findings.push(
      finding('profile-unknown', 'error', 'The code profile must be "uk-iec", "us-nec" or a full profile; using UK/IEC.', {
        subject: 'profile',
      }),
    );
    profile = codeProfile('uk-iec');
  }
  const firm: CvFirmSettings = typeof input.firm === 'object' && input.firm !== null ? input.firm : {};
  const supply = input.supply;
  const supplyName = shown(supply?.name ?? supply?.id ?? 'supply');

  // The firm's limit, else 5 % (BS 7671 Section 715's figure for ELV lighting). The code
  // profile's general drop figure (NEC 3 % for branch circuits) is advisory mains guidance and
  // is not imposed on 12/24 V runs unless the firm sets it.
  let dropLimitPct = firm.dropLimitPct ?? DEFAULT_CV_DROP_LIMIT_PCT;
  if (!isPositive(dropLimitPct) || dropLimitPct >= 100) {
    findings.push(
      finding(
        'setting-invalid',
        'error',
        `The drop limit must be a percentage above 0 and below 100; using ${DEFAULT_CV_DROP_LIMIT_PCT} %.`,
        { subject: 'firm:dropLimitPct' },
      ),
    );
    dropLimitPct = DEFAULT_CV_DROP_LIMIT_PCT;
  }
  let loadingLimitPct = firm.supplyLoadingLimitPct ?? DEFAULT_SUPPLY_LOADING_LIMIT_PCT;
  if (!isPositive(loadingLimitPct)) {
    findings.push(
      finding(
        'setting-invalid',
        'error',
        `The supply loading limit must be a percentage above 0; using ${DEFAULT_SUPPLY_LOADING_LIMIT_PCT} %.`,
        { subject: 'firm:supplyLoadingLimitPct' },
      ),
    );
    loadingLimitPct = DEFAULT_SUPPLY_LOADING_LIMIT_PCT;
  }
  let temperatureC = input.temperatureC ?? profile.dropWorkingTemperatureC;
  if (typeof temperatureC !== 'number' || !Number.isFinite(temperatureC)) {
    findings.push(
      finding('cable-temperature-invalid', 'error', 'The conductor temperature must be a number of °C; using 20 °C.', {
        subject: 'temperatureC',
      }),
    );
    temperatureC = 20;
  }

  const empty = (supplyV: number): CvResult => ({
    supplyId: supply?.id ?? '',
    nominalVoltageV: supplyV,
    temperatureC,
    dropLimitPct,
    fittingCount: 0,
    loadW: 0,
    currentA: 0,
    outputW: 0,
    cableLossW: 0,
    loadingPct: 0,
    loadingLimitPct,
    runs: [],
    worst: null,
    findings,
  });

  if (typeof supply !== 'object' || supply === null || !isPositive(supply.nominalVoltageV) || !isPositive(supply.ratedPowerW)) {
    findings.push(
      finding('cv-supply-invalid', 'error', 'The supply needs a nominal voltage and a rated power, both above zero.', {
        subject: 'supply',
      }),
    );
    return empty(0);
  }
  const vs = supply.nominalVoltageV;
  if (supply.output === 'constant-current') {
    findings.push(
      finding(
        'cv-supply-not-constant-voltage',
        'error',
        `"${supplyName}" is a constant-current driver; fittings wired in parallel need a constant-voltage supply.`,
        {
          subject: 'supply',
        },
      ),
    );
  }
  for (const limit of elvLimitsExceeded(profile, vs)) {
    findings.push(
      finding(limit.code, limit.severity, `The supply's ${vs} V is above ${limit.dcMaxV} V DC: ${limit.consequence}`, {
        subject: 'supply',
        values: { voltageV: vs, limitV: limit.dcMaxV, citation: limit.citation },
      }),
    );
  }
  findings.push(
    ...checkIpForLocation(supply.ipCode, supply.location, {
      subject: 'supply',
      prefix: 'driver',
      what: `The supply "${supplyName}"`,
      ...(firm.ipOverrides ? { overrides: firm.ipOverrides } : {}),
    }),
  );

  // Stocked cables, smallest first (by cross-section, then by resistance, highest first).
  const options: { id: string; name: string; areaMm2: number; ohmPerM: number; spec: CableSpec }[] = [];
  for (const [i, o] of listOf(input.cableOptions, 'cable options', findings).entries()) {
    const subject = `cable-option:${o?.id ?? i + 1}`;
    const ohmPerM = o && typeof o === 'object' ? cableOhmPerM(o.cable, temperatureC, subject, findings) : null;
    if (ohmPerM === null) continue;
    options.push({
      id: o.id,
      name: o.name ?? describeCable(o.cable),
      areaMm2: conductorBase(o.cable).areaMm2,
      ohmPerM,
      spec: o.cable,
    });
  }
  options.sort((a, b) => a.areaMm2 - b.areaMm2 || b.ohmPerM - a.ohmPerM);

  const runs: CvRunResult[] = [];
  const runIds = new Set<string>();
  let loadW = 0;
  let currentA = 0;
  let lossW = 0;
  let fittingCount = 0;
  let worst: CvWorst | null = null;

  for (const [ri, run] of listOf(input.runs, 'runs', findings).entries()) {
    const prepared = prepareRun(run, ri, vs, findings, firm.ipOverrides);
    if (!prepared) continue;
    if (runIds.has(prepared.id)) {
      findings.push(
        finding('cv-run-duplicate-id', 'warning', `Run id "${prepared.id}" is used twice.`, { subject: `run:${prepared.id}` }),
      );
    }
    runIds.add(prepared.id);
    const runSubject = `run:${prepared.id}`;
    const spanR = cableOhmPerM(run.cable, temperatureC, `${runSubject}/cable`, findings);
    const feederR =
      run.layout === 'hub' && run.feeder.cable
        ? cableOhmPerM(run.feeder.cable, temperatureC, `${runSubject}/feeder`, findings)
        : spanR;
    if (spanR === null || feederR === null) continue;

    const v = runVoltages(prepared.run, vs, spanR, feederR);
    if (!Number.isFinite(v.lossW) || !v.voltagesV.every(Number.isFinite)) {
      findings.push(
        finding(
          'cv-run-out-of-range',
          'error',
          `Run ${prepared.id} gives figures too large to compute; check its lengths and fitting powers.`,
          { subject: runSubject },
        ),
      );
      continue;
    }
    const { ok, worstIndex } = judge(prepared.run, v, vs, dropLimitPct);
    // One pass, sized once. A run of thousands of fittings out of limits gives two findings a
    // fitting, so they are written as the finding() helper writes them (same keys, same order)
    // without its spread and its extra object, and the shown voltage is written once for both
    // messages. (Flattening each message, as the installer steps do, cost more than it saved.)
    const count = v.voltagesV.length;
    const fittings = new Array<CvFittingResult>(count);
    for (let k = 0; k < count; k++) {
      const volts = v.voltagesV[k]!;
      const dropV = vs - volts;
      const dropPct = (dropV / vs) * 100;
      const min = prepared.run.minVoltagesV[k] ?? null;
      const r: CvFittingResult = {
        runId: prepared.id,
        position: k + 1,
        fittingId: prepared.run.fittingIds[k]!,
        currentA: prepared.run.currentsA[k]!,
        voltageV: volts,
        dropV,
        dropPct,
        minVoltageV: min,
        withinDropLimit: dropPct <= dropLimitPct + EPS,
        aboveOwnMinimum: min === null || volts >= min - EPS,
      };
      fittings[k] = r;
      if (r.withinDropLimit && r.aboveOwnMinimum) continue;
      // the subject and the shown voltage are written out only for a fitting that gets a finding
      const subject = `${runSubject}/fitting:${r.fittingId}`;
      const shownV = `${roundForDisplay(volts)}`;
      if (!r.withinDropLimit) {
        findings.push({
          code: 'cv-drop-over-limit',
          severity: 'warning',
          message: `Fitting "${r.fittingId}" gets ${shownV} V, a ${roundForDisplay(dropPct, 1)} % drop, over the ${dropLimitPct} % limit: it will be dimmer than the rest.`,
          subject,
          values: { voltageV: roundForDisplay(volts, 3), dropPct: roundForDisplay(dropPct, 2), limitPct: dropLimitPct },
        });
      }
      if (!r.aboveOwnMinimum) {
        findings.push({
          code: 'cv-below-fitting-minimum',
          severity: 'error',
          message: `Fitting "${r.fittingId}" gets ${shownV} V, below the ${min} V it needs to work properly.`,
          subject,
          values: { voltageV: roundForDisplay(volts, 3), minVoltageV: min ?? 0 },
        });
      }
    }

    let smallestCable: CvCableChoice | null = null;
    const scratch: number[] = [];
    for (const o of options) {
      const ov = runVoltages(prepared.run, vs, o.ohmPerM, o.ohmPerM, scratch);
      const j = judge(prepared.run, ov, vs, dropLimitPct);
      if (j.ok) {
        const wv = j.worstIndex < 0 ? vs : ov.voltagesV[j.worstIndex]!;
        smallestCable = { id: o.id, name: o.name, areaMm2: o.areaMm2, worstVoltageV: wv, worstDropPct: ((vs - wv) / vs) * 100 };
        break;
      }
    }
    if (options.length > 0 && prepared.run.currentsA.length > 0) {
      if (smallestCable === null) {
        findings.push(
          finding(
            'cv-no-stocked-cable-fits',
            'warning',
            `No stocked cable keeps every fitting on run "${prepared.id}" within the limits; shorten or split the run, or feed it from a hub or home runs.`,
            {
              subject: runSubject,
            },
          ),
        );
      } else if (!ok) {
        findings.push(
          finding(
            'cv-cable-suggestion',
            'info',
            `On run "${prepared.id}", ${smallestCable.name} keeps every fitting within the limits (worst ${roundForDisplay(smallestCable.worstVoltageV)} V).`,
            {
              subject: runSubject,
              values: { cableId: smallestCable.id, worstVoltageV: roundForDisplay(smallestCable.worstVoltageV, 3) },
            },
          ),
        );
      }
    }

    const runWorst: CvWorst | null =
      worstIndex < 0
        ? null
        : {
            runId: prepared.id,
            fittingId: fittings[worstIndex]!.fittingId,
            voltageV: fittings[worstIndex]!.voltageV,
            dropPct: fittings[worstIndex]!.dropPct,
          };
    if (runWorst && (worst === null || runWorst.voltageV < worst.voltageV)) worst = runWorst;
    const cableLengthM = prepared.run.lengthsM.reduce((s, x) => s + x, 0) + prepared.run.feederLengthM;
    runs.push({
      id: prepared.id,
      layout: run.layout,
      fittings,
      worst: runWorst,
      currentA: prepared.run.totalCurrentA,
      cableLengthM,
      cableLossW: v.lossW,
      smallestCable,
    });
    loadW += prepared.loadW;
    currentA += prepared.run.totalCurrentA;
    lossW += v.lossW;
    fittingCount += fittings.length;
  }

  const outputW = vs * currentA;
  let loadingPct = (outputW / supply.ratedPowerW) * 100;
  if (!Number.isFinite(loadingPct) || !Number.isFinite(outputW)) {
    findings.push(
      finding(
        'cv-run-out-of-range',
        'error',
        'The supply loading is too large to compute; check the fitting powers and the supply rating.',
        { subject: 'supply' },
      ),
    );
    loadingPct = Number.MAX_VALUE;
  }
  if (loadingPct > 100 + EPS) {
    findings.push(
      finding(
        'cv-supply-over-rating',
        'error',
        `The fittings draw ${roundForDisplay(outputW, 1)} W from a ${supply.ratedPowerW} W supply (${roundForDisplay(loadingPct, 0)} %): it will shut down or fail.`,
        {
          subject: 'supply',
          values: {
            outputW: roundForDisplay(outputW, 2),
            ratedPowerW: supply.ratedPowerW,
            loadingPct: roundForDisplay(loadingPct, 1),
          },
        },
      ),
    );
  } else if (loadingPct > loadingLimitPct + EPS) {
    findings.push(
      finding(
        'cv-supply-overloaded',
        'warning',
        `The supply is loaded to ${roundForDisplay(loadingPct, 0)} % of its ${supply.ratedPowerW} W, over the ${loadingLimitPct} % the firm allows; choose a larger supply or split the load.`,
        {
          subject: 'supply',
          values: {
            outputW: roundForDisplay(outputW, 2),
            ratedPowerW: supply.ratedPowerW,
            loadingPct: roundForDisplay(loadingPct, 1),
            limitPct: loadingLimitPct,
          },
        },
      ),
    );
  }

  return {
    supplyId: supply.id,
    nominalVoltageV: vs,
    temperatureC,
    dropLimitPct,
    fittingCount,
    loadW,
    currentA,
    outputW,
    cableLossW: lossW,
    loadingPct,
    loadingLimitPct,
    runs,
    worst,
    findings,
  };
}

/** A fitting's subject on a run; written out only when a finding needs it. */
function fittingSubject(runSubject: string, fittingId: string): string {
  return `${runSubject}/fitting:${fittingId}`;
}

/** Validate a run and reduce it to numbers; null (with findings) when it cannot be computed. */
function prepareRun(
  run: CvRun,
  index: number,
  vs: number,
  findings: Finding[],
  ipOverrides: IpOverrides | undefined,
): { id: string; run: PreparedCvRun; loadW: number } | null {
  const id = typeof run?.id === 'string' && run.id !== '' ? run.id : `${index + 1}`;
  const subject = `run:${id}`;
  if (typeof run !== 'object' || run === null || !Array.isArray(run.spans)) {
    findings.push(
      finding('cv-run-invalid', 'error', `Run ${id} needs a list of fittings with their cable lengths.`, { subject }),
    );
    return null;
  }
  if (run.layout !== 'daisy-chain' && run.layout !== 'home-run' && run.layout !== 'hub') {
    findings.push(finding('cv-run-invalid', 'error', `Run ${id} must be a daisy chain, home run or hub.`, { subject }));
    return null;
  }
  let ok = true;
  let feederLengthM = 0;
  if (run.layout === 'hub') {
    try {
      feederLengthM = lengthInMetres(run.feeder?.length, `${subject}/feeder`);
    } catch (e) {
      if (!isEngineInputError(e)) throw e;
      findings.push(e.finding);
      ok = false;
    }
  }
  if (run.spans.length === 0) {
    findings.push(finding('cv-run-empty', 'warning', `Run ${id} has no fittings.`, { subject }));
  }
  // Sized once: a fitting is only skipped when the run fails (and these are dropped).
  const count = run.spans.length;
  const lengthsM = new Array<number>(count);
  const currentsA = new Array<number>(count);
  const minVoltagesV = new Array<number | null>(count);
  const fittingIds = new Array<string>(count);
  let loadW = 0;
  const ipChecks = new Map<string, Finding[]>();
  // Most fittings on a run share an IP code and location: the last pair's check is kept at
  // hand, so the map (and its key text) is only needed when the pair changes.
  let lastIpCode: unknown;
  let lastLocation: unknown;
  let lastShape: Finding[] | null = null;
  for (let k = 0; k < count; k++) {
    const span = run.spans[k]!; // a hole reads as undefined, handled below as before
    const f = span?.fitting;
    const fid = typeof f?.id === 'string' && f.id !== '' ? f.id : `${k + 1}`;
    let lengthM: number;
    try {
      lengthM = lengthInMetres(span?.length);
    } catch (e) {
      if (!isEngineInputError(e)) throw e;
      try {
        lengthInMetres(span?.length, fittingSubject(subject, fid));
      } catch (named) {
        if (!isEngineInputError(named)) throw named;
        findings.push(named.finding);
      }
      ok = false;
      continue;
    }
    if (typeof f !== 'object' || f === null || !isNonNegative(f.powerW)) {
      findings.push(
        finding('cv-fitting-invalid', 'error', `Fitting ${fid} on run ${id} needs a power in watts, zero or more.`, {
          subject: fittingSubject(subject, fid),
        }),
      );
      ok = false;
      continue;
    }
    const rated = f.nominalVoltageV ?? vs;
    if (!isPositive(rated) || (f.minVoltageV !== undefined && !isPositive(f.minVoltageV))) {
      findings.push(
        finding(
          'cv-fitting-invalid',
          'error',
          `Fitting ${fid} on run ${id} has a rated or minimum voltage that is not above zero.`,
          { subject: fittingSubject(subject, fid) },
        ),
      );
      ok = false;
      continue;
    }
    if (Math.abs(rated - vs) > 0.01 * vs) {
      findings.push(
        finding(
          'cv-fitting-voltage-mismatch',
          'error',
          `Fitting ${fid} is rated ${rated} V but the supply is ${vs} V; use fittings and supply of the same voltage.`,
          {
            subject: fittingSubject(subject, fid),
            values: { fittingV: rated, supplyV: vs },
          },
        ),
      );
    }
    if (f.drive === 'constant-current') {
      findings.push(
        finding(
          'cc-fitting-on-cv-supply',
          'error',
          `Fitting ${fid} is a constant-current fitting: on a constant-voltage supply it would be destroyed (common practice). It needs a constant-current driver, wired in series.`,
          {
            subject: fittingSubject(subject, fid),
          },
        ),
      );
    }
    if (f.location !== undefined) {
      // Most fittings on a run share an IP code and location: check each pair once per run.
      let shape: Finding[] | undefined;
      if (lastShape !== null && typeof f.ipCode === 'string' && f.ipCode === lastIpCode && f.location === lastLocation) shape = lastShape;
      else {
        const key = `${shown(f.ipCode)}|${shown(f.location)}`;
        shape = ipChecks.get(key);
        if (!shape) {
          shape = checkIpForLocation(f.ipCode, f.location, {
            subject: '',
            prefix: 'fitting',
            what: '\u0000',
            ...(ipOverrides ? { overrides: ipOverrides } : {}),
          });
          ipChecks.set(key, shape);
        }
        lastIpCode = f.ipCode;
        lastLocation = f.location;
        lastShape = shape;
      }
      for (const x of shape) findings.push({ ...x, subject: fittingSubject(subject, fid), message: x.message.replace('\u0000', `Fitting ${fid}`) });
    }
    lengthsM[k] = lengthM;
    currentsA[k] = f.powerW / rated;
    minVoltagesV[k] = f.minVoltageV ?? null;
    fittingIds[k] = fid;
    loadW += f.powerW;
  }
  if (!ok) return null;
  const totalCurrentA = currentsA.reduce((s, x) => s + x, 0);
  return {
    id,
    run: { id, layout: run.layout, lengthsM, currentsA, minVoltagesV, fittingIds, feederLengthM, totalCurrentA },
    loadW,
  };
}
