import { z } from 'zod';
import { IpCodeText } from './catalogue';
import { CABLE_METHODS, CodeProfileId, INSTALLATION_LOCATIONS, type CircuitCheckSettings } from './circuits';

/**
 * A firm's circuit-design settings: labour times, cable slack and cut length, the voltage-drop
 * limit, driver headroom, minimum IP codes by location and the code profile. A quote revision
 * snapshots them beside its pricing (RevisionSettings.design), so a sent revision keeps them.
 */

export const percentBpField = (what: string, max: number) =>
  z
    .number(`Enter ${what}.`)
    .int(`${what[0]!.toUpperCase()}${what.slice(1)} is a whole number of hundredths of a per cent.`)
    .min(0, 'Cannot be negative.')
    .max(max, `At most ${max / 100} %.`);

/** Minutes with at most three decimals (the engine holds thousandths of a minute exactly). */
const Minutes = z
  .number('Enter minutes.')
  .min(0, 'Cannot be negative.')
  .max(1440, 'At most a day (1440 minutes).')
  .refine((m) => Math.abs(Math.round(m * 1000) - m * 1000) < 1e-6, 'Use at most three decimals.');

/** How long each circuit task takes this firm's crew; the hourly rate is separate. */
export const LabourMinutes = z.object({
  minutesPerFitting: Minutes,
  minutesPerDriver: Minutes,
  minutesPerConnectorBlock: Minutes,
  minutesPerMetre: z.object(Object.fromEntries(CABLE_METHODS.map((m) => [m, Minutes])) as Record<(typeof CABLE_METHODS)[number], typeof Minutes>),
  minutesPerCircuitTest: Minutes,
});
export type LabourMinutes = z.infer<typeof LabourMinutes>;

/**
 * Minutes per task for a firm that has not set its own: common practice for small
 * exterior-lighting crews (an estimate, not a standard).
 */
export const DEFAULT_LABOUR_MINUTES: LabourMinutes = {
  minutesPerFitting: 20,
  minutesPerDriver: 30,
  minutesPerConnectorBlock: 15,
  minutesPerMetre: { 'surface-clipped': 1.5, 'buried-trench': 6, 'in-duct': 2.5 },
  minutesPerCircuitTest: 20,
};

export const IpMinimums = z.partialRecord(z.enum(INSTALLATION_LOCATIONS), IpCodeText);
export type IpMinimums = z.infer<typeof IpMinimums>;

/** The circuit-design settings a revision snapshots beside its pricing. */
export const DesignSettings = z.object({
  labourMinutes: LabourMinutes,
  /** Extra cable on top of measured runs (1000 = 10 %). */
  cableSlackBp: percentBpField('the cable slack', 10_000),
  /** Cable bought in whole multiples of this length unless the product says otherwise, mm. */
  cableCutLengthMm: z
    .number('Enter a cut length.')
    .int('A cut length is whole millimetres.')
    .min(100, 'At least 0.1 m.')
    .max(500_000, 'At most 500 m.'),
  /** Largest voltage drop allowed on a low-voltage run, % of nominal in basis points. */
  voltageDropLimitBp: percentBpField('the voltage-drop limit', 2000).refine((v) => v >= 50, 'At least 0.5 %.'),
  /** Power a driver or supply keeps in hand above the load (1000 = 10 %). */
  driverHeadroomBp: percentBpField('the driver headroom', 5000),
  /** The firm's own minimum IP codes, location by location (others use the defaults). */
  ipMinimums: IpMinimums,
  codeProfile: CodeProfileId,
});
export type DesignSettings = z.infer<typeof DesignSettings>;


/**
 * For a firm that has not saved its own: 10 % cable slack and 1 m cut lengths (the engine's
 * takeoff defaults, common practice), the profile's usual 5 % drop (BS 7671 Section 715, from
 * memory), 10 % driver headroom (common practice), the engine's default IP minimums.
 */
export const DEFAULT_DESIGN_SETTINGS: DesignSettings = {
  labourMinutes: DEFAULT_LABOUR_MINUTES,
  cableSlackBp: 1000,
  cableCutLengthMm: 1000,
  voltageDropLimitBp: 500,
  driverHeadroomBp: 1000,
  ipMinimums: {},
  codeProfile: 'uk-iec',
};

/**
 * The circuit checks' settings from a revision's design settings (basis points become the
 * engine's per cent). A revision made before firms had design settings has none: it keeps
 * the profile it was checked with (`fallbackProfile`) and the engine's defaults.
 */
export function checkSettingsOf(design: DesignSettings | undefined, fallbackProfile: CodeProfileId): CircuitCheckSettings {
  if (!design) return { profile: fallbackProfile };
  return {
    profile: design.codeProfile,
    headroomMarginPct: design.driverHeadroomBp / 100,
    dropLimitPct: design.voltageDropLimitBp / 100,
    ipOverrides: { ...design.ipMinimums },
  };
}
