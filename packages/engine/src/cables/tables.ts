/**
 * Standard conductor-resistance tables, copied as fixtures. Values are the published
 * maxima; a real cable is usually a little better, which keeps drop estimates on the safe side.
 */

/** Metric cross-sections the IEC 60228 fixture below covers, mm². */
export const IEC_60228_SIZES_MM2 = [0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10] as const;
export type Iec60228SizeMm2 = (typeof IEC_60228_SIZES_MM2)[number];

export interface Iec60228Row {
  /** Class 1 (solid) and class 2 (stranded) share these maxima for the sizes listed. */
  class12Plain: number;
  class12Tinned: number;
  /** Class 5: flexible. */
  class5Plain: number;
  class5Tinned: number;
}

/**
 * Maximum DC resistance of annealed copper conductors at 20 °C, ohm/km.
 * Source: IEC 60228:2004 Table 1 (class 1), Table 2 (class 2), Table 3 (class 5).
 */
export const IEC_60228_R20_OHM_PER_KM: Readonly<Record<Iec60228SizeMm2, Iec60228Row>> = {
  0.5: { class12Plain: 36.0, class12Tinned: 36.7, class5Plain: 39.0, class5Tinned: 40.1 },
  0.75: { class12Plain: 24.5, class12Tinned: 24.8, class5Plain: 26.0, class5Tinned: 26.7 },
  1: { class12Plain: 18.1, class12Tinned: 18.2, class5Plain: 19.5, class5Tinned: 20.0 },
  1.5: { class12Plain: 12.1, class12Tinned: 12.2, class5Plain: 13.3, class5Tinned: 13.7 },
  2.5: { class12Plain: 7.41, class12Tinned: 7.56, class5Plain: 7.98, class5Tinned: 8.21 },
  4: { class12Plain: 4.61, class12Tinned: 4.7, class5Plain: 4.95, class5Tinned: 5.09 },
  6: { class12Plain: 3.08, class12Tinned: 3.11, class5Plain: 3.3, class5Tinned: 3.39 },
  10: { class12Plain: 1.83, class12Tinned: 1.84, class5Plain: 1.91, class5Tinned: 1.95 },
};

/**
 * Temperature coefficient of resistance of annealed copper at 20 °C, per °C.
 * Source: IEC 60287-1-1 Table 1 (alpha20 = 3.93e-3); IEC 60228 Annex B.
 */
export const COPPER_ALPHA_20 = 0.00393;

/** Resistivity of annealed copper at 20 °C, ohm·m. Source: IEC 60287-1-1 Table 1. */
export const COPPER_RESISTIVITY_20_OHM_M = 1.7241e-8;

/** AWG sizes the NEC fixture below covers. */
export const NEC_TABLE_8_GAUGES = [18, 16, 14, 12, 10, 8] as const;
export type NecTable8Gauge = (typeof NEC_TABLE_8_GAUGES)[number];

/**
 * DC resistance of uncoated copper conductors at 75 °C, ohm per 1,000 ft.
 * Source: NFPA 70 (National Electrical Code) Chapter 9, Table 8, "Conductor Properties".
 */
export const NEC_TABLE_8_R75_OHM_PER_KFT: Readonly<Record<NecTable8Gauge, { solid: number; stranded: number }>> = {
  18: { solid: 7.77, stranded: 7.95 },
  16: { solid: 4.89, stranded: 4.99 },
  14: { solid: 3.07, stranded: 3.14 },
  12: { solid: 1.93, stranded: 1.98 },
  10: { solid: 1.21, stranded: 1.24 },
  8: { solid: 0.764, stranded: 0.778 },
};

/** Reference temperature of NEC Chapter 9 Table 8, °C. */
export const NEC_TABLE_8_REFERENCE_C = 75;

/**
 * Temperature coefficient for copper in the NEC Chapter 9 Table 8 note:
 * R2 = R1 [1 + 0.00323 (T2 - 75)].
 */
export const NEC_TABLE_8_COPPER_ALPHA_75 = 0.00323;

/**
 * Nominal conductor cross-sections, mm², used when suggesting the nearest metric size for an
 * AWG gauge. IEC 60228 nominal size series; sizes above 10 mm² from memory (the resistance
 * fixture above stops at 10 mm²).
 */
export const METRIC_NOMINAL_SIZES_MM2 = [0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50] as const;
