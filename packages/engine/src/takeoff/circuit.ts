/**
 * The structural shape of a circuit that takeoff and labour read: what is on it, not how it
 * behaves electrically. Products are referred to by catalogue id; the catalogue says what
 * each product is (fitting, driver, cable...) and what it costs.
 */
import type { Length } from '../units/length';

export type CircuitKind = 'constant-current' | 'constant-voltage';

/** How a cable run is laid, which sets the labour per metre. */
export const INSTALLATION_METHODS = ['surface-clipped', 'buried-trench', 'in-duct'] as const;
export type InstallationMethod = (typeof INSTALLATION_METHODS)[number];

export interface CircuitItem {
  productId: string;
  /** Whole number of items (default 1). */
  count?: number;
}

export interface CircuitCableRun {
  /** For messages, e.g. `lead`, `link-2`; default the run's position. */
  id?: string;
  cableProductId: string;
  length: Length;
  method: InstallationMethod;
}

export interface TakeoffCircuit {
  id: string;
  kind: CircuitKind;
  /** The constant-current driver or constant-voltage supply feeding the circuit. */
  powerProductId: string;
  fittings: CircuitItem[];
  cableRuns: CircuitCableRun[];
  connectorBlocks?: CircuitItem[];
  /** Cable-entry seals and reducers. */
  seals?: CircuitItem[];
  /** Enclosures, mounting spikes, brackets, clips... */
  accessories?: CircuitItem[];
}

/**
 * What a catalogue product is, for takeoff and labour. `driver` is a constant-current
 * driver, `supply` a constant-voltage power supply.
 */
export const PRODUCT_CATEGORIES = [
  'fitting',
  'driver',
  'supply',
  'cable',
  'connector-block',
  'seal',
  'reducer',
  'enclosure',
  'mounting',
] as const;
export type ProductCategory = (typeof PRODUCT_CATEGORIES)[number];

export interface TakeoffProduct {
  id: string;
  name: string;
  category: ProductCategory;
  /** For fittings: the kind the labour table prices, e.g. `spike`, `in-ground`, `wall`. */
  fittingKind?: string;
  /** Trade cost per unit (per metre for cable), minor units. */
  unitCostMinor?: number;
  /** Sell price per unit ex VAT (per metre for cable), minor units. */
  unitPriceMinor?: number;
  /** Cable only: sold in multiples of this many metres (overrides the firm's cut length). */
  cutLengthM?: number;
}
