import type { ProductInput } from '@gloaming/contracts';

/**
 * The demo firm's catalogue: invented products from an invented wholesaler, one or more of
 * every kind. Figures are plausible trade values (common practice), not any maker's data.
 * Each entry is checked against the contracts' ProductInput when seeded.
 * `code` is the supplier code the demo quotes refer to.
 */
export const DEMO_SUPPLIER = 'Fernlea Trade Lighting';

const cc = (
  ratings: { currentA: number; forwardVoltageV: number; lumens?: number }[],
  optics: { beamAngleDeg?: number; colourTemperatureK?: number; ipCode: string; tailM?: number },
) => ({
  driveMode: 'constant-current' as const,
  ratings,
  ...(optics.beamAngleDeg ? { beamAngleDeg: optics.beamAngleDeg } : {}),
  colourTemperatureK: optics.colourTemperatureK ?? 2700,
  ipCode: optics.ipCode,
  ...(optics.tailM
    ? {
        tail: {
          lengthM: optics.tailM,
          conductor: { kind: 'metric' as const, areaMm2: 0.75, conductorClass: 5 as const, coating: 'plain' as const },
        },
      }
    : {}),
});

const cv = (nominalVoltageV: 12 | 24, powerW: number, ipCode: string, beamAngleDeg?: number) => ({
  driveMode: 'constant-voltage' as const,
  nominalVoltageV,
  powerW,
  colourTemperatureK: 3000,
  ipCode,
  ...(beamAngleDeg ? { beamAngleDeg } : {}),
});

const item = (p: Omit<ProductInput, 'supplier' | 'description'> & { description?: string }): ProductInput =>
  ({ supplier: DEMO_SUPPLIER, description: '', ...p }) as ProductInput;

export const DEMO_PRODUCTS: readonly ProductInput[] = [
  // constant-current fittings: forward voltage at each drive current (350 / 500 / 700 mA)
  item({
    kind: 'fitting',
    supplierCode: 'FTL-SP1',
    name: 'Sorrel spike spot 1 W',
    unit: 'each',
    costMinor: 1890,
    listPriceMinor: 3400,
    spec: cc([{ currentA: 0.35, forwardVoltageV: 3.0, lumens: 95 }], { beamAngleDeg: 36, ipCode: 'IP67', tailM: 1 }),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-SP3',
    name: 'Sorrel spike spot 3 W',
    unit: 'each',
    costMinor: 2450,
    listPriceMinor: 4400,
    spec: cc(
      [
        { currentA: 0.35, forwardVoltageV: 8.9, lumens: 260 },
        { currentA: 0.5, forwardVoltageV: 9.3, lumens: 350 },
        { currentA: 0.7, forwardVoltageV: 9.8, lumens: 450 },
      ],
      { beamAngleDeg: 24, ipCode: 'IP67', tailM: 2 },
    ),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-UP5',
    name: 'Bracken ground uplight 5 W',
    unit: 'each',
    costMinor: 4120,
    listPriceMinor: 7200,
    spec: cc(
      [
        { currentA: 0.35, forwardVoltageV: 14.2, lumens: 410 },
        { currentA: 0.5, forwardVoltageV: 14.8, lumens: 560 },
        { currentA: 0.7, forwardVoltageV: 15.6, lumens: 720 },
      ],
      { beamAngleDeg: 40, ipCode: 'IP68', tailM: 1 },
    ),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-PL2',
    name: 'Thistle path light 2 W',
    unit: 'each',
    costMinor: 3120,
    listPriceMinor: 5600,
    spec: cc(
      [
        { currentA: 0.35, forwardVoltageV: 6.1, lumens: 140 },
        { currentA: 0.5, forwardVoltageV: 6.4, lumens: 190 },
      ],
      { ipCode: 'IP65', tailM: 1 },
    ),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-WL3',
    name: 'Larchmere wall light 3 W',
    unit: 'each',
    costMinor: 3650,
    listPriceMinor: 6400,
    spec: cc(
      [
        { currentA: 0.35, forwardVoltageV: 9.0, lumens: 240 },
        { currentA: 0.7, forwardVoltageV: 9.9, lumens: 430 },
      ],
      { beamAngleDeg: 60, ipCode: 'IP65', tailM: 0.5 },
    ),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-UW2',
    name: 'Reedmace underwater spot 2 W',
    unit: 'each',
    costMinor: 5480,
    listPriceMinor: 9200,
    spec: cc(
      [
        { currentA: 0.35, forwardVoltageV: 6.0, lumens: 150 },
        { currentA: 0.5, forwardVoltageV: 6.3, lumens: 200 },
      ],
      { beamAngleDeg: 30, ipCode: 'IP68', tailM: 5 },
    ),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-DK1',
    name: 'Pebble deck light 1 W',
    unit: 'each',
    costMinor: 1480,
    listPriceMinor: 2700,
    spec: cc([{ currentA: 0.35, forwardVoltageV: 3.1, lumens: 70 }], { beamAngleDeg: 120, ipCode: 'IP67', tailM: 1 }),
  }),
  // constant-voltage fittings (12 V and 24 V)
  item({
    kind: 'fitting',
    supplierCode: 'FTL-BL12',
    name: 'Flintwood bollard 12 V 4 W',
    unit: 'each',
    costMinor: 6890,
    listPriceMinor: 11900,
    spec: cv(12, 4, 'IP65'),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-ST24',
    name: 'Hazelrow step light 24 V 1.5 W',
    unit: 'each',
    costMinor: 2240,
    listPriceMinor: 3900,
    spec: cv(24, 1.5, 'IP67', 90),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-TP24',
    name: 'Willowbank tape 24 V 9.6 W/m',
    unit: 'm',
    costMinor: 780,
    listPriceMinor: 1450,
    spec: cv(24, 9.6, 'IP67', 120),
  }),
  item({
    kind: 'fitting',
    supplierCode: 'FTL-WW12',
    name: 'Quarrystone wall washer 12 V 6 W',
    unit: 'each',
    costMinor: 4590,
    listPriceMinor: 7900,
    spec: cv(12, 6, 'IP66', 100),
  }),
  // drivers: output current with voltage and power windows
  item({
    kind: 'driver',
    supplierCode: 'FTL-D350',
    name: 'Fernlea driver 350 mA 3-48 V',
    unit: 'each',
    costMinor: 1650,
    listPriceMinor: 2900,
    spec: {
      currentA: 0.35,
      voltageWindowV: { minV: 3, maxV: 48 },
      powerWindowW: { minW: 1, maxW: 16.8 },
      maxPowerW: 16.8,
      efficiencyPct: 84,
      ipCode: 'IP67',
      dimming: 'none',
    },
  }),
  item({
    kind: 'driver',
    supplierCode: 'FTL-D500',
    name: 'Fernlea driver 500 mA 9-42 V',
    unit: 'each',
    costMinor: 1980,
    listPriceMinor: 3500,
    spec: {
      currentA: 0.5,
      voltageWindowV: { minV: 9, maxV: 42 },
      powerWindowW: { minW: 4.5, maxW: 21 },
      maxPowerW: 21,
      efficiencyPct: 86,
      ipCode: 'IP67',
      dimming: 'none',
    },
  }),
  item({
    kind: 'driver',
    supplierCode: 'FTL-D700',
    name: 'Fernlea driver 700 mA 9-42 V',
    unit: 'each',
    costMinor: 2290,
    listPriceMinor: 3990,
    spec: {
      currentA: 0.7,
      voltageWindowV: { minV: 9, maxV: 42 },
      powerWindowW: { minW: 6.3, maxW: 29.4 },
      maxPowerW: 29.4,
      efficiencyPct: 87,
      ipCode: 'IP67',
      dimming: 'phase-cut',
    },
  }),
  item({
    kind: 'driver',
    supplierCode: 'FTL-D700D',
    name: 'Fernlea dimmable driver 700 mA 12-56 V',
    unit: 'each',
    costMinor: 3840,
    listPriceMinor: 6500,
    spec: {
      currentA: 0.7,
      voltageWindowV: { minV: 12, maxV: 56 },
      powerWindowW: { minW: 8.4, maxW: 39.2 },
      maxPowerW: 39.2,
      efficiencyPct: 89,
      ipCode: 'IP66',
      dimming: 'DALI',
    },
  }),
  // constant-voltage supplies
  item({
    kind: 'cv-supply',
    supplierCode: 'FTL-PS12-60',
    name: 'Fernlea supply 12 V 60 W',
    unit: 'each',
    costMinor: 2890,
    listPriceMinor: 4900,
    spec: { outputVoltageV: 12, ratedPowerW: 60, ipCode: 'IP67' },
  }),
  item({
    kind: 'cv-supply',
    supplierCode: 'FTL-PS24-100',
    name: 'Fernlea supply 24 V 100 W',
    unit: 'each',
    costMinor: 4250,
    listPriceMinor: 7200,
    spec: { outputVoltageV: 24, ratedPowerW: 100, ipCode: 'IP67' },
  }),
  item({
    kind: 'cv-supply',
    supplierCode: 'FTL-PS24-150',
    name: 'Fernlea supply 24 V 150 W',
    unit: 'each',
    costMinor: 5690,
    listPriceMinor: 9400,
    spec: { outputVoltageV: 24, ratedPowerW: 150, ipCode: 'IP66' },
  }),
  // cables (IEC 60228 class 5 flexible copper, the usual choice for garden runs)
  item({
    kind: 'cable',
    supplierCode: 'FTL-C2-15',
    name: 'Twin outdoor cable 1.5 mm²',
    unit: 'm',
    costMinor: 184,
    listPriceMinor: 320,
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 1.5, conductorClass: 5, coating: 'plain' } },
  }),
  item({
    kind: 'cable',
    supplierCode: 'FTL-C2-25',
    name: 'Twin outdoor cable 2.5 mm²',
    unit: 'm',
    costMinor: 276,
    listPriceMinor: 480,
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 2.5, conductorClass: 5, coating: 'plain' } },
  }),
  item({
    kind: 'cable',
    supplierCode: 'FTL-C2-25R',
    name: 'Twin outdoor cable 2.5 mm², 50 m coil',
    unit: 'coil',
    costMinor: 12400,
    listPriceMinor: 21000,
    spec: { cores: 2, conductor: { kind: 'metric', areaMm2: 2.5, conductorClass: 5, coating: 'plain' }, cutLengthM: 50 },
  }),
  // connector blocks
  item({
    kind: 'connector-block',
    supplierCode: 'FTL-J3',
    name: 'Gel-filled junction 3 way',
    unit: 'each',
    costMinor: 410,
    listPriceMinor: 790,
    spec: { terminals: 3, entries: 3, conductorsPerTerminal: 2, ipCode: 'IP68' },
  }),
  item({
    kind: 'connector-block',
    supplierCode: 'FTL-J5',
    name: 'Gel-filled junction 5 way',
    unit: 'each',
    costMinor: 690,
    listPriceMinor: 1250,
    spec: { terminals: 5, entries: 5, conductorsPerTerminal: 2, ipCode: 'IP68' },
  }),
  item({
    kind: 'connector-block',
    supplierCode: 'FTL-JB4',
    name: 'Screw-down junction box 4 entry',
    unit: 'each',
    costMinor: 520,
    listPriceMinor: 980,
    spec: { terminals: 4, entries: 4, conductorsPerTerminal: 3, ipCode: 'IP66' },
  }),
  // sundries
  item({
    kind: 'accessory',
    supplierCode: 'FTL-SPK',
    name: 'Ground spike, 200 mm',
    unit: 'each',
    costMinor: 260,
    listPriceMinor: 520,
    spec: {},
  }),
  item({
    kind: 'accessory',
    supplierCode: 'FTL-DUCT',
    name: 'Flexible duct 20 mm',
    unit: 'm',
    costMinor: 95,
    listPriceMinor: 190,
    spec: {},
  }),
  item({
    kind: 'accessory',
    supplierCode: 'FTL-ENC',
    name: 'Weatherproof driver enclosure',
    unit: 'each',
    costMinor: 1150,
    listPriceMinor: 2100,
    spec: {},
  }),
  item({
    kind: 'accessory',
    supplierCode: 'FTL-GLD',
    name: 'Cable glands M20, pack of 10',
    unit: 'pack',
    costMinor: 480,
    listPriceMinor: 900,
    spec: {},
  }),
  // labour (cost is the firm's own rate for that time)
  item({
    kind: 'labour',
    supplierCode: 'LAB-FIT',
    name: 'Install and aim a fitting',
    unit: 'each',
    costMinor: 1500,
    listPriceMinor: 2500,
    spec: { minutes: 20 },
  }),
  item({
    kind: 'labour',
    supplierCode: 'LAB-TRN',
    name: 'Trench, lay duct and backfill',
    unit: 'm',
    costMinor: 900,
    listPriceMinor: 1500,
    spec: { minutes: 12 },
  }),
  item({
    kind: 'labour',
    supplierCode: 'LAB-DRV',
    name: 'Mount and wire a driver or supply',
    unit: 'each',
    costMinor: 2250,
    listPriceMinor: 3750,
    spec: { minutes: 30 },
  }),
  item({
    kind: 'labour',
    supplierCode: 'LAB-NIT',
    name: 'Evening commissioning visit',
    unit: 'visit',
    costMinor: 9000,
    listPriceMinor: 15000,
    spec: { minutes: 120 },
  }),
];
