import { EngineInputError } from '../units/engine-input-error';
import { METRIC_NOMINAL_SIZES_MM2 } from './tables';

/**
 * American Wire Gauge geometry from the defining formula
 * d = 0.127 mm · 92^((36 − n) / 39) (ASTM B258; attribution from memory).
 * Gauges are integers; 1/0, 2/0, 3/0 and 4/0 are 0, −1, −2 and −3.
 */
export const AWG_MIN_GAUGE = -3;
export const AWG_MAX_GAUGE = 40;

function assertGauge(gauge: number): void {
  if (!Number.isInteger(gauge) || gauge < AWG_MIN_GAUGE || gauge > AWG_MAX_GAUGE) {
    throw new EngineInputError(
      'awg-gauge-invalid',
      `AWG gauge must be a whole number from 4/0 (written −3) to 40; got ${String(gauge)}.`,
    );
  }
}

export function awgDiameterMm(gauge: number): number {
  assertGauge(gauge);
  return 0.127 * Math.pow(92, (36 - gauge) / 39);
}

export function awgAreaMm2(gauge: number): number {
  const d = awgDiameterMm(gauge);
  return (Math.PI / 4) * d * d;
}

/** The (fractional) gauge whose area is `areaMm2`: the exact inverse of awgAreaMm2. */
export function awgGaugeForAreaMm2(areaMm2: number): number {
  if (!Number.isFinite(areaMm2) || areaMm2 <= 0) {
    throw new EngineInputError('cable-area-invalid', 'A conductor cross-section must be a positive number of mm².');
  }
  const d = Math.sqrt((4 * areaMm2) / Math.PI);
  return 36 - (39 * Math.log(d / 0.127)) / Math.log(92);
}

/**
 * The even AWG gauge nearest to a metric cross-section, nearest on a logarithmic (ratio)
 * scale. Even gauges are the ones stocked for building wire; this reproduces the
 * 0.75→18, 1.5→16, 2.5→14, 4→12, 6→10, 10→8 pairs of ISO/IEC 61918 Annex F.
 */
export function nearestAwgGauge(areaMm2: number): number {
  const exact = awgGaugeForAreaMm2(areaMm2);
  const lower = Math.floor(exact / 2) * 2;
  const candidates = [lower, lower + 2].filter((g) => g >= AWG_MIN_GAUGE && g <= AWG_MAX_GAUGE);
  if (candidates.length === 0) {
    throw new EngineInputError('cable-area-invalid', `No AWG gauge is near ${areaMm2} mm².`);
  }
  let best = candidates[0]!;
  let bestErr = Infinity;
  for (const g of candidates) {
    const err = Math.abs(Math.log(awgAreaMm2(g) / areaMm2));
    if (err < bestErr) {
      best = g;
      bestErr = err;
    }
  }
  return best;
}

/** The nominal metric cross-section nearest (on a ratio scale) to an AWG gauge. */
export function nearestMetricSizeMm2(gauge: number): number {
  const area = awgAreaMm2(gauge);
  let best: number = METRIC_NOMINAL_SIZES_MM2[0];
  let bestErr = Infinity;
  for (const s of METRIC_NOMINAL_SIZES_MM2) {
    const err = Math.abs(Math.log(s / area));
    if (err < bestErr) {
      best = s;
      bestErr = err;
    }
  }
  return best;
}

/** "14", "1/0", "4/0" for display. */
export function formatAwg(gauge: number): string {
  assertGauge(gauge);
  return gauge <= 0 ? `${1 - gauge}/0` : String(gauge);
}
