import { EngineInputError } from '../units/engine-input-error';
import { ohmPerKftToOhmPerKm } from '../units/length';
import { awgAreaMm2, formatAwg } from './awg';
import {
  COPPER_ALPHA_20,
  IEC_60228_R20_OHM_PER_KM,
  IEC_60228_SIZES_MM2,
  NEC_TABLE_8_COPPER_ALPHA_75,
  NEC_TABLE_8_GAUGES,
  NEC_TABLE_8_R75_OHM_PER_KFT,
  NEC_TABLE_8_REFERENCE_C,
  type Iec60228SizeMm2,
  type NecTable8Gauge,
} from './tables';

/** A resistance the cable's supplier states on the datasheet; it overrides the table. */
export interface StatedResistance {
  ohmPerKm: number;
  /** Temperature the figure is stated at, °C (default 20). */
  atC?: number;
}

/** Copper conductor by metric cross-section (IEC 60228). */
export interface MetricCableSpec {
  kind: 'metric';
  areaMm2: number;
  /** IEC 60228 class: 1 solid, 2 stranded, 5 flexible. */
  conductorClass: 1 | 2 | 5;
  coating: 'plain' | 'tinned';
  stated?: StatedResistance;
  /** Display name, e.g. "2-core 1.5 mm² flex". */
  name?: string;
}

/** Copper conductor by American Wire Gauge (NEC Chapter 9 Table 8, uncoated). */
export interface AwgCableSpec {
  kind: 'awg';
  /** Whole gauge; 1/0 is 0, 4/0 is −3. */
  gauge: number;
  stranding: 'solid' | 'stranded';
  stated?: StatedResistance;
  name?: string;
}

export type CableSpec = MetricCableSpec | AwgCableSpec;

/** Where a cable's resistance came from. */
export type ResistanceSource = 'iec-60228' | 'nec-chapter-9-table-8' | 'supplier';

/** A conductor's resistance at its table's reference temperature, with the rule to move it. */
export interface ConductorBase {
  ohmPerKm: number;
  atC: number;
  source: ResistanceSource;
  /** Cross-section, mm² (AWG from the diameter formula). */
  areaMm2: number;
}

/** Lowest and highest working temperatures accepted, °C. */
export const CABLE_TEMPERATURE_MIN_C = -50;
export const CABLE_TEMPERATURE_MAX_C = 200;

function sizeKey(areaMm2: number): Iec60228SizeMm2 | undefined {
  return IEC_60228_SIZES_MM2.find((s) => Math.abs(s - areaMm2) < 1e-9);
}

function gaugeKey(gauge: number): NecTable8Gauge | undefined {
  return NEC_TABLE_8_GAUGES.find((g) => g === gauge);
}

/** A short description for messages: "1.5 mm² class 5 plain", "14 AWG stranded". */
export function describeCable(spec: CableSpec): string {
  if (spec.name) return spec.name;
  if (spec.kind === 'metric') return `${spec.areaMm2} mm² class ${spec.conductorClass} ${spec.coating}`;
  const g = Number.isInteger(spec.gauge) && spec.gauge >= -3 && spec.gauge <= 40 ? formatAwg(spec.gauge) : String(spec.gauge);
  return `${g} AWG ${spec.stranding}`;
}

function invalid(message: string, subject?: string): EngineInputError {
  return new EngineInputError('cable-spec-invalid', message, subject === undefined ? {} : { subject });
}

/**
 * Resolve a cable spec to its base resistance. Order: the supplier's stated figure if given,
 * else IEC 60228 (metric) or NEC Chapter 9 Table 8 (AWG). Throws EngineInputError
 * (`cable-spec-invalid`, `cable-size-not-in-table`) when neither is available.
 */
export function conductorBase(spec: CableSpec, subject?: string): ConductorBase {
  if (typeof spec !== 'object' || spec === null) throw invalid('A cable needs a conductor size.', subject);
  let areaMm2: number;
  if (spec.kind === 'metric') {
    if (!Number.isFinite(spec.areaMm2) || spec.areaMm2 <= 0) {
      throw invalid('A metric cable needs a positive cross-section in mm².', subject);
    }
    if (spec.conductorClass !== 1 && spec.conductorClass !== 2 && spec.conductorClass !== 5) {
      throw invalid('A metric cable must be IEC 60228 class 1, 2 or 5.', subject);
    }
    if (spec.coating !== 'plain' && spec.coating !== 'tinned') {
      throw invalid('A metric cable must be plain or tinned copper.', subject);
    }
    areaMm2 = spec.areaMm2;
  } else if (spec.kind === 'awg') {
    if (!Number.isInteger(spec.gauge) || spec.gauge < -3 || spec.gauge > 40) {
      throw invalid('An AWG cable needs a whole gauge from 4/0 (−3) to 40.', subject);
    }
    if (spec.stranding !== 'solid' && spec.stranding !== 'stranded') {
      throw invalid('An AWG cable must be solid or stranded.', subject);
    }
    areaMm2 = awgAreaMm2(spec.gauge);
  } else {
    throw invalid('A cable must be given by mm² (kind "metric") or by AWG (kind "awg").', subject);
  }

  if (spec.stated !== undefined) {
    const atC = spec.stated.atC ?? 20;
    if (!Number.isFinite(spec.stated.ohmPerKm) || spec.stated.ohmPerKm <= 0 || !Number.isFinite(atC)) {
      throw invalid("The supplier's stated resistance must be a positive ohm/km figure.", subject);
    }
    return { ohmPerKm: spec.stated.ohmPerKm, atC, source: 'supplier', areaMm2 };
  }

  if (spec.kind === 'metric') {
    const key = sizeKey(spec.areaMm2);
    if (key === undefined) {
      throw new EngineInputError(
        'cable-size-not-in-table',
        `${spec.areaMm2} mm² is not in the IEC 60228 table the engine holds (0.5 to 10 mm²); enter the supplier's stated resistance.`,
        subject === undefined ? { values: { areaMm2: spec.areaMm2 } } : { subject, values: { areaMm2: spec.areaMm2 } },
      );
    }
    const row = IEC_60228_R20_OHM_PER_KM[key];
    const ohmPerKm =
      spec.conductorClass === 5
        ? spec.coating === 'plain'
          ? row.class5Plain
          : row.class5Tinned
        : spec.coating === 'plain'
          ? row.class12Plain
          : row.class12Tinned;
    return { ohmPerKm, atC: 20, source: 'iec-60228', areaMm2 };
  }

  const g = gaugeKey(spec.gauge);
  if (g === undefined) {
    throw new EngineInputError(
      'cable-size-not-in-table',
      `${formatAwg(spec.gauge)} AWG is not in the NEC Table 8 rows the engine holds (18 to 8 AWG); enter the supplier's stated resistance.`,
      subject === undefined ? { values: { gauge: spec.gauge } } : { subject, values: { gauge: spec.gauge } },
    );
  }
  const ohmPerKft = NEC_TABLE_8_R75_OHM_PER_KFT[g][spec.stranding];
  return { ohmPerKm: ohmPerKftToOhmPerKm(ohmPerKft), atC: NEC_TABLE_8_REFERENCE_C, source: 'nec-chapter-9-table-8', areaMm2 };
}

function assertTemperature(temperatureC: number, subject?: string): void {
  if (!Number.isFinite(temperatureC) || temperatureC < CABLE_TEMPERATURE_MIN_C || temperatureC > CABLE_TEMPERATURE_MAX_C) {
    throw new EngineInputError(
      'cable-temperature-invalid',
      `A conductor working temperature must be between ${CABLE_TEMPERATURE_MIN_C} and ${CABLE_TEMPERATURE_MAX_C} °C.`,
      subject === undefined ? {} : { subject },
    );
  }
}

/**
 * Move a base resistance to another temperature.
 * - NEC Table 8 values use the table's own note: R2 = R1 [1 + 0.00323 (T2 − 75)].
 * - IEC 60228 and supplier figures use alpha20 = 0.00393 (IEC 60287-1-1):
 *   R(t) = R20 (1 + 0.00393 (t − 20)); a supplier figure stated at another temperature
 *   is first brought back to 20 °C with the same line.
 */
export function resistanceAtTemperatureOhmPerKm(base: ConductorBase, temperatureC: number): number {
  if (base.source === 'nec-chapter-9-table-8') {
    return base.ohmPerKm * (1 + NEC_TABLE_8_COPPER_ALPHA_75 * (temperatureC - base.atC));
  }
  const r20 = base.ohmPerKm / (1 + COPPER_ALPHA_20 * (base.atC - 20));
  return r20 * (1 + COPPER_ALPHA_20 * (temperatureC - 20));
}

/**
 * Resistance of one conductor of the cable, ohm per metre, at `temperatureC` (default 20 °C;
 * use the code profile's `dropWorkingTemperatureC` for voltage-drop work).
 * Throws EngineInputError for an unknown size or a bad spec.
 */
export function conductorResistanceOhmPerM(spec: CableSpec, temperatureC = 20): number {
  assertTemperature(temperatureC);
  return resistanceAtTemperatureOhmPerKm(conductorBase(spec), temperatureC) / 1000;
}

/**
 * Loop resistance of a two-core run `lengthM` long: current goes out on one core and back
 * on the other, so R_loop = 2 · length · R per metre.
 */
export function loopResistanceOhm(spec: CableSpec, lengthM: number, temperatureC = 20): number {
  if (!Number.isFinite(lengthM) || lengthM < 0) {
    throw new EngineInputError('length-invalid', 'A cable length must be zero or more metres.');
  }
  return 2 * lengthM * conductorResistanceOhmPerM(spec, temperatureC);
}
