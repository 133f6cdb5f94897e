import type { Severity } from '../findings';

/**
 * Code profiles: the wiring-rule figures a design is checked against. A design aid only:
 * mains work, protective devices and certification follow local wiring rules and a licensed
 * electrician.
 */

/** One extra-low-voltage limit a constant-current string's compliance voltage is held to. */
export interface ElvLimit {
  /** Stable machine code used in the finding, e.g. `above-selv-limit`. */
  code: string;
  /** Highest DC voltage, V. */
  dcMaxV: number;
  /** The matching AC rms figure, V (for display). */
  acMaxV: number;
  severity: Severity;
  /** Plain-English consequence of going over, for the estimator. */
  consequence: string;
  citation: string;
}

export interface CodeProfile {
  id: CodeProfileId;
  name: string;
  /** Limits, most severe consequence first. */
  elvLimits: ElvLimit[];
  /** Default voltage-drop limit for low-voltage runs, % of nominal. */
  voltageDropLimitPct: number;
  voltageDropCitation: string;
  /** Conductor temperature to use for voltage-drop work, °C. */
  dropWorkingTemperatureC: number;
  workingTemperatureCitation: string;
}

export const CODE_PROFILE_IDS = ['uk-iec', 'us-nec'] as const;
export type CodeProfileId = (typeof CODE_PROFILE_IDS)[number];

export const UK_IEC_PROFILE: CodeProfile = {
  id: 'uk-iec',
  name: 'UK / IEC (BS 7671, IEC 61140, IEC 60598-1)',
  elvLimits: [
    {
      code: 'above-selv-limit',
      // IEC 61140 / IEV (IEC 61558-1 3.7.16): SELV/PELV at most 50 V AC rms or 120 V ripple-free DC
      dcMaxV: 120,
      acMaxV: 50,
      severity: 'error',
      consequence: 'the string is no longer SELV: it is treated as low voltage and needs mains-grade protection.',
      citation: 'IEC 61140; IEC 61558-1 3.7.16 (SELV 50 V AC / 120 V ripple-free DC)',
    },
    {
      code: 'above-exposed-selv-outdoor-limit',
      // IEC 60598-1 8.2.3: Class III luminaires with exposed SELV parts, other than ordinary
      // (outdoor) conditions, 12 V AC / 30 V DC; BS 7671 414.4.5: basic protection may be
      // omitted only up to 12 V AC / 30 V DC outside normal dry conditions.
      dcMaxV: 30,
      acMaxV: 12,
      severity: 'warning',
      consequence:
        'outdoors every live part (terminals, connector blocks, lamp contacts) must be insulated or enclosed; no exposed SELV parts.',
      citation: 'IEC 60598-1 8.2.3 (outdoor 12 V AC / 30 V DC); BS 7671 414.4.5',
    },
  ],
  // BS 7671 Section 715: drop from the ELV source to the furthest luminaire within 5 % of nominal (from memory)
  voltageDropLimitPct: 5,
  voltageDropCitation: 'BS 7671 Section 715 (5 % from ELV source to furthest luminaire; from memory)',
  // BS 7671 Appendix 4 tabulated mV/A/m values are for conductors at 70 °C (thermoplastic insulation)
  dropWorkingTemperatureC: 70,
  workingTemperatureCitation: 'BS 7671 Appendix 4 (70 °C thermoplastic conductor operating temperature)',
};

export const US_NEC_PROFILE: CodeProfile = {
  id: 'us-nec',
  name: 'US (NFPA 70, National Electrical Code)',
  elvLimits: [
    {
      code: 'above-nec-411-limit',
      // NEC 411: low-voltage lighting systems 30 V AC / 60 V DC (the 60 V DC dry figure from memory)
      dcMaxV: 60,
      acMaxV: 30,
      severity: 'error',
      consequence: 'the string is outside an Article 411 low-voltage lighting system and is wired by Chapter 3 methods.',
      citation: 'NEC 411 (30 V AC / 60 V DC; 60 V DC figure from memory)',
    },
    {
      code: 'above-nec-wet-contact-limit',
      // NEC 411 wet contact 15 V AC / 30 V DC; Chapter 9 Table 11(B) notes: 30 V continuous DC where wet contact is likely
      dcMaxV: 30,
      acMaxV: 15,
      severity: 'warning',
      consequence: 'where wet contact is likely (gardens, ponds), exposed parts above this need listed protection.',
      citation: 'NEC 411 wet contact 15 V AC / 30 V DC; NEC Chapter 9 Table 11(B) notes',
    },
  ],
  // NEC 210.19(A) informational note: 3 % on a branch circuit (5 % feeder plus branch); advisory
  voltageDropLimitPct: 3,
  voltageDropCitation: 'NEC 210.19(A) informational note (3 % branch; advisory, not enforceable)',
  // NEC Chapter 9 Table 8 conductor resistances are stated at 75 °C
  dropWorkingTemperatureC: 75,
  workingTemperatureCitation: 'NEC Chapter 9 Table 8 (resistances at 75 °C)',
};

export const CODE_PROFILES: Readonly<Record<CodeProfileId, CodeProfile>> = {
  'uk-iec': UK_IEC_PROFILE,
  'us-nec': US_NEC_PROFILE,
};

export function isCodeProfileId(x: unknown): x is CodeProfileId {
  return typeof x === 'string' && (CODE_PROFILE_IDS as readonly string[]).includes(x);
}

/** A profile by id, or the profile itself when one is passed (a firm may tailor a copy). */
export function codeProfile(profile: CodeProfileId | CodeProfile): CodeProfile {
  return typeof profile === 'string' ? CODE_PROFILES[profile] : profile;
}

/** The limits a compliance voltage exceeds, most severe first. */
export function elvLimitsExceeded(profile: CodeProfile, voltageDcV: number): ElvLimit[] {
  return profile.elvLimits.filter((l) => voltageDcV > l.dcMaxV);
}

/** Highest DC voltage the profile allows without an error, V. */
export function elvErrorLimitV(profile: CodeProfile): number {
  const errors = profile.elvLimits.filter((l) => l.severity === 'error').map((l) => l.dcMaxV);
  return errors.length === 0 ? Infinity : Math.min(...errors);
}
