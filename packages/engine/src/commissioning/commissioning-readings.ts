/**
 * Commissioning: the readings an installer takes when a circuit is first powered, what each
 * should read (from the circuit's evaluation), and which entered readings fall outside the
 * expected range. Pure: JSON in and out.
 *
 * Ranges (design aids; the driver's or supply's data sheet wins when it says otherwise):
 * - constant-current output current: the driver's rated current ± 5 % (common practice for
 *   driver current tolerance);
 * - constant-current output voltage: the string's compliance voltage (forward voltages plus
 *   cable drop) ± 10 % (LED forward voltage moves with temperature and binning; ± 10 % is
 *   common practice);
 * - voltage across the far fitting: its forward voltage at the drive current ± 10 % (as above);
 * - constant-voltage output voltage: nominal ± 5 % (common practice for supply regulation);
 * - constant-voltage far-fitting voltage: from the drop limit below nominal (BS 7671 Section
 *   715, 5 %, from memory; or the firm's limit) up to nominal;
 * - constant-voltage current: the fittings' rated draw, up to 10 % over (common practice);
 * - insulation resistance of the ELV wiring: at least 0.5 MΩ at a 250 V DC test voltage for
 *   SELV/PELV circuits (BS 7671 Table 64, from memory), with the driver disconnected.
 * Checks the installer ticks: polarity, every connector block and gland sealed, and that the
 * mains side (RCD, isolation, certification) has been done by a licensed electrician.
 */
import { finding, type Finding } from '../findings';
import type { CircuitEvaluation } from '../circuit-design/evaluate-circuit';

export type ReadingUnit = 'V' | 'A' | 'MΩ';

export interface ExpectedReading {
  key: string;
  label: string;
  unit: ReadingUnit;
  /** What it should read; null when only a bound is known. */
  expected: number | null;
  min: number | null;
  max: number | null;
  /** How the range was worked out, in words. */
  basis: string;
}

export interface CommissioningCheck {
  key: string;
  label: string;
}

export interface CommissioningPlan {
  readings: ExpectedReading[];
  checks: CommissioningCheck[];
  /** Findings from working out the plan (e.g. no driver chosen, so no current to expect). */
  findings: Finding[];
}

export type ReadingStatus = 'in-range' | 'low' | 'high' | 'not-entered' | 'no-range';

export interface JudgedReading extends ExpectedReading {
  value: number | null;
  status: ReadingStatus;
}

export interface CommissioningJudgement {
  readings: JudgedReading[];
  checks: (CommissioningCheck & { done: boolean })[];
  /** Readings outside the expected range. */
  flagged: number;
  /** Every reading entered, every check ticked, nothing out of range. */
  complete: boolean;
  findings: Finding[];
}

const INSULATION_MIN_MOHM = 0.5;

/**
 * Round for display and range ends, half-up to three decimals (finer than any site meter
 * reads); the tiny nudge keeps 0.35 · 0.95 = 0.3325 from rounding down on its float error.
 */
const r3 = (x: number): number => Math.round(x * 1000 + 1e-7) / 1000;

export const COMMISSIONING_CHECKS: readonly CommissioningCheck[] = [
  { key: 'polarity-checked', label: 'Polarity checked at every block: + to + along the string, return to the driver −' },
  { key: 'insulation-tested', label: 'Insulation resistance tested, driver disconnected' },
  { key: 'seals-checked', label: 'Every connector block, gland and entry sealed (gel set, caps tight, IP rating kept)' },
  {
    key: 'mains-by-electrician',
    label: 'Mains supply, RCD protection, isolation and certification done by a licensed electrician (local wiring rules)',
  },
];

const insulation: ExpectedReading = {
  key: 'insulation-resistance',
  label: 'Insulation resistance, conductors to earth (250 V DC test)',
  unit: 'MΩ',
  expected: null,
  min: INSULATION_MIN_MOHM,
  max: null,
  basis: 'at least 0.5 MΩ for SELV/PELV wiring at 250 V DC (BS 7671 Table 64, from memory)',
};

/** What to measure on a circuit and the range each reading should fall in. */
export function commissioningPlan(evaluation: CircuitEvaluation): CommissioningPlan {
  const readings: ExpectedReading[] = [];
  const findings: Finding[] = [];
  if (evaluation.kind === 'constant-current') {
    const s = evaluation.series;
    if (!s) {
      findings.push(
        finding(
          'commissioning-no-driver',
          'warning',
          'No driver is chosen for this circuit, so there is no output to expect yet.',
        ),
      );
    } else {
      readings.push({
        key: 'output-current',
        label: 'Output current at the driver',
        unit: 'A',
        expected: r3(s.currentA),
        min: r3(s.currentA * 0.95),
        max: r3(s.currentA * 1.05),
        basis: "the driver's rated current ± 5 % (common practice)",
      });
      readings.push({
        key: 'output-voltage',
        label: 'String voltage at the driver output',
        unit: 'V',
        expected: r3(s.complianceVoltageV),
        min: r3(s.complianceVoltageV * 0.9),
        max: r3(s.complianceVoltageV * 1.1),
        basis: `forward voltages ${r3(s.stringForwardVoltageV)} V plus cable drop ${r3(s.cableDropV)} V, ± 10 % (common practice)`,
      });
      const last = s.fittings.at(-1);
      if (last)
        readings.push({
          key: 'far-fitting-voltage',
          label: `Voltage across the last fitting (fitting ${s.fittings.length})`,
          unit: 'V',
          expected: r3(last.forwardVoltageV),
          min: r3(last.forwardVoltageV * 0.9),
          max: r3(last.forwardVoltageV * 1.1),
          basis: 'its forward voltage at the drive current ± 10 % (common practice)',
        });
    }
  } else {
    const cv = evaluation.cv;
    if (!cv) {
      findings.push(
        finding(
          'commissioning-no-supply',
          'warning',
          'No supply is chosen for this circuit, so there is no output to expect yet.',
        ),
      );
    } else {
      const v = cv.nominalVoltageV;
      readings.push({
        key: 'output-voltage',
        label: 'Voltage at the supply output',
        unit: 'V',
        expected: r3(v),
        min: r3(v * 0.95),
        max: r3(v * 1.05),
        basis: 'nominal ± 5 % (common practice)',
      });
      readings.push({
        key: 'output-current',
        label: 'Current drawn from the supply',
        unit: 'A',
        expected: r3(cv.currentA),
        min: null,
        max: r3(cv.currentA * 1.1),
        basis: "the fittings' rated draw, at most 10 % over (common practice)",
      });
      if (cv.worst)
        readings.push({
          key: 'far-fitting-voltage',
          label: 'Voltage at the far fitting (the lowest on the circuit)',
          unit: 'V',
          expected: r3(cv.worst.voltageV),
          min: r3(v * (1 - cv.dropLimitPct / 100)),
          max: r3(v),
          basis: `at most ${cv.dropLimitPct} % below nominal (BS 7671 Section 715, from memory, or the firm's limit)`,
        });
    }
  }
  readings.push(insulation);
  return { readings, checks: [...COMMISSIONING_CHECKS], findings };
}

/** Readings entered on site: numbers by reading key (null or absent when not taken), ticks by check key. */
export interface CommissioningEntries {
  readings: Record<string, number | null | undefined>;
  checks: Record<string, boolean | undefined>;
}

/** Each entered reading against its range; every reading outside it is a warning naming both. */
export function judgeReadings(plan: CommissioningPlan, entries: CommissioningEntries): CommissioningJudgement {
  const findings: Finding[] = [];
  let flagged = 0;
  const readings = plan.readings.map((e): JudgedReading => {
    const raw = entries.readings[e.key];
    const value = typeof raw === 'number' && Number.isFinite(raw) ? raw : null;
    let status: ReadingStatus;
    if (value === null) status = 'not-entered';
    else if (e.min === null && e.max === null) status = 'no-range';
    else if (e.min !== null && value < e.min) status = 'low';
    else if (e.max !== null && value > e.max) status = 'high';
    else status = 'in-range';
    if (status === 'low' || status === 'high') {
      flagged++;
      const range =
        e.min !== null && e.max !== null
          ? `${e.min}-${e.max} ${e.unit}`
          : e.min !== null
            ? `at least ${e.min} ${e.unit}`
            : `at most ${e.max} ${e.unit}`;
      findings.push(
        finding(
          'reading-out-of-range',
          'warning',
          `${e.label}: ${value} ${e.unit} is ${status === 'low' ? 'below' : 'above'} the expected ${range} (${e.basis}). ` +
            'Find the cause before handing over.',
          {
            subject: `reading:${e.key}`,
            values: { value: value!, ...(e.min !== null ? { min: e.min } : {}), ...(e.max !== null ? { max: e.max } : {}) },
          },
        ),
      );
    }
    return { ...e, value, status };
  });
  const checks = plan.checks.map((c) => ({ ...c, done: entries.checks[c.key] === true }));
  const complete = flagged === 0 && readings.every((r) => r.value !== null) && checks.every((c) => c.done);
  return { readings, checks, flagged, complete, findings };
}
