/**
 * The installer's pack PDF as plain data: every string formatted, the block plans reduced to
 * what the diagram and the schedule tables draw. Built on the request thread from the pack
 * the api already serves (so page and PDF say the same), rendered in the PDF worker. Never
 * carries a price, cost or margin.
 */
export interface PackPdfTable {
  title: string;
  head: string[];
  rows: string[][];
}

export interface PackPdfDiagram {
  driverName: string;
  blocks: { number: number; fittings: number[] }[];
  links: { number: number; lengthM: number | null }[];
  fittingLabels: string[];
}

/** A constant-voltage circuit's runs as the run diagram draws them, every figure formatted. */
export interface PackPdfRunDiagram {
  supplyName: string;
  /** e.g. "12 V". */
  nominal: string;
  /** e.g. "V at each fitting · drop from 12 V (limit 5 %)". */
  legend: string;
  runs: {
    title: string;
    /** Over the pair from the supply: "feeder 6 m" (hub), "at the supply" (home run) or "". */
    lead: string;
    hub: boolean;
    /** Span words are drawn along the pair (daisy chain) or beside each fitting's own cable. */
    alongPair: boolean;
    fittings: { number: string; label: string; span: string; voltage: string; drop: string; low: boolean }[];
  }[];
}

export interface PackPdfReading {
  label: string;
  expected: string;
  range: string;
  measured: string;
  /** "" when in range or not entered; else e.g. "LOW" / "HIGH". */
  flag: string;
}

export interface PackPdfCircuit {
  title: string;
  kind: string;
  power: string;
  summary: string;
  diagram: PackPdfDiagram | null;
  /** Constant voltage: the run diagram. */
  runDiagram: PackPdfRunDiagram | null;
  schedules: PackPdfTable[];
  steps: string[];
  /** Constant voltage: each run and the voltage expected at each fitting. */
  runs: PackPdfTable | null;
  pick: PackPdfTable;
  readings: PackPdfReading[];
  checks: { label: string; done: boolean }[];
  note: string;
  /** The as-wired record when there is one: its verdict and what to change. */
  asWired: { safe: boolean; lines: string[] } | null;
}

export interface InstallerPackPdfModel {
  firmName: string;
  reference: string;
  title: string;
  revision: number;
  status: string;
  printedOn: string;
  customer: { name: string; phone: string };
  site: { label: string; lines: string[]; accessNotes: string };
  caution: string;
  loads: PackPdfTable[];
  circuits: PackPdfCircuit[];
}
