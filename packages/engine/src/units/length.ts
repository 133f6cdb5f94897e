import { EngineInputError } from './engine-input-error';

/** Lengths arrive from metric or imperial site drawings; the engine works in metres. */
export type LengthUnit = 'm' | 'ft';

export interface Length {
  value: number;
  unit: LengthUnit;
}

/** International foot, exact by definition (1959 international yard and pound agreement). */
export const METRES_PER_FOOT = 0.3048;

export function feetToMetres(feet: number): number {
  return feet * METRES_PER_FOOT;
}

export function metresToFeet(metres: number): number {
  return metres / METRES_PER_FOOT;
}

/** Ohm per 1,000 ft (US tables) to ohm per km. */
export function ohmPerKftToOhmPerKm(ohmPerKft: number): number {
  return ohmPerKft / METRES_PER_FOOT;
}

/** Ohm per km to ohm per 1,000 ft. */
export function ohmPerKmToOhmPerKft(ohmPerKm: number): number {
  return ohmPerKm * METRES_PER_FOOT;
}

/**
 * A length in metres. Throws EngineInputError (code `length-invalid`) for a negative,
 * non-finite or unit-less length.
 */
export function lengthInMetres(length: Length, subject?: string): number {
  const ok = typeof length === 'object' && length !== null && Number.isFinite(length.value) && length.value >= 0;
  if (!ok || (length.unit !== 'm' && length.unit !== 'ft')) {
    throw new EngineInputError(
      'length-invalid',
      'A cable length must be a number of metres or feet, zero or more.',
      subject === undefined ? {} : { subject },
    );
  }
  return length.unit === 'm' ? length.value : feetToMetres(length.value);
}

export function metres(value: number): Length {
  return { value, unit: 'm' };
}

export function feet(value: number): Length {
  return { value, unit: 'ft' };
}
