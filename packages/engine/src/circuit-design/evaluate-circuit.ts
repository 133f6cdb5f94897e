/**
 * The one mapping from a designed circuit (placements, runs, product ids) and the catalogue
 * products it names to the engine's inputs, and the checks run on them. The api runs it on
 * every save and stores the result; the workbench runs it as the estimator types. Both pass
 * the same design and products, so both get the same answer.
 *
 * Constant current: the series-string check (or, with no driver yet, the string at the
 * chosen drive current), the connector-block plan and the wiring check of that plan.
 * Constant voltage: the parallel-run check. Findings from the design itself (a product that
 * is not in the catalogue, a driver whose current is not the one the fittings were set to)
 * sit beside the engine's, and any finding the estimator acknowledged carries the reason.
 */
import { planConnectorBlocks, type BlockPlan } from '../blocks/block-plan';
import type { ConnectorBlockType } from '../blocks/connector-block';
import { blockLayoutFromSeries } from '../blocks/from-series-layout';
import type { CableSpec } from '../cables/cable-spec';
import { checkCvRuns } from '../cv/parallel-run';
import type { CvFitting, CvInput, CvResult, CvRun, CvSupply } from '../cv/cv-types';
import { compareDriveCurrents, type DriveCurrentOption } from '../drivers/drive-current-what-if';
import { finding, type Finding } from '../findings';
import { checkSeriesString } from '../series/series-string';
import type { CableRun, LedDriver, SeriesFitting, SeriesStringResult, StringLayout } from '../series/series-types';
import { metres } from '../units/length';
import { roundForDisplay as r2 } from '../units/round';
import { checkWiring, type WiringCheckResult } from '../wiring/wiring-check';
import type {
  CcCircuitDesign,
  CircuitDesign,
  CircuitSettings,
  CvCircuitDesign,
  DesignAcknowledgement,
  DesignConductor,
  DesignProduct,
  FittingProductSpec,
} from './design-types';

/** A finding with the estimator's acknowledgement, when there is one. */
export interface CircuitFinding extends Finding {
  /** The reason given when the estimator accepted this finding, else null. */
  acknowledged: string | null;
}

/** The string at the fittings' drive current when no driver is chosen yet. */
export type StringPreview = Omit<DriveCurrentOption, 'driver'>;

export interface CircuitEvaluation {
  kind: CircuitDesign['kind'];
  /** No error finding left unacknowledged: nothing here blocks sending the quote. */
  ok: boolean;
  /** Errors not acknowledged. */
  blockingCount: number;
  findings: CircuitFinding[];
  series: SeriesStringResult | null;
  preview: StringPreview | null;
  blocks: BlockPlan | null;
  wiring: WiringCheckResult | null;
  cv: CvResult | null;
}

/** The engine inputs a design maps to (null where the design is not complete enough). */
export type CircuitInputs =
  | {
      kind: 'constant-current';
      layout: StringLayout | null;
      driver: LedDriver | null;
      blockType: ConnectorBlockType | null;
      assignment: string[][] | null;
      /** The current the fittings are set to, when they agree. */
      driveCurrentA: number | null;
      findings: Finding[];
    }
  | { kind: 'constant-voltage'; input: CvInput | null; findings: Finding[] };

type Kind = DesignProduct['kind'];
type ProductOf<K extends Kind> = Extract<DesignProduct, { kind: K }>;

const KIND_WORDS: Record<Kind, string> = {
  fitting: 'a light fitting',
  driver: 'an LED driver',
  'cv-supply': 'a 12/24 V supply',
  cable: 'a cable',
  'connector-block': 'a connector block',
  accessory: 'a sundry',
  labour: 'a labour item',
};

/** Looks products up by id and records what is missing or of the wrong kind. */
class ProductLookup {
  private readonly byId = new Map<string, DesignProduct>();
  constructor(
    products: readonly DesignProduct[],
    private readonly findings: Finding[],
  ) {
    for (const p of products) this.byId.set(p.id, p);
  }

  get<K extends Kind>(id: string, kinds: readonly K[], subject: string, what: string): ProductOf<K> | null {
    const p = this.byId.get(id);
    if (!p) {
      this.findings.push(
        finding('product-not-in-catalogue', 'error', `The ${what} is not in the catalogue any more; choose another.`, {
          subject,
          values: { productId: id },
        }),
      );
      return null;
    }
    if (!(kinds as readonly Kind[]).includes(p.kind)) {
      this.findings.push(
        finding(
          'product-wrong-kind',
          'error',
          `"${p.name}" is ${KIND_WORDS[p.kind]}, not ${kinds.map((k) => KIND_WORDS[k]).join(' or ')}.`,
          {
            subject,
            values: { productId: id },
          },
        ),
      );
      return null;
    }
    return p as ProductOf<K>;
  }
}

export function cableSpecOf(conductor: DesignConductor, statedOhmPerKm?: number): CableSpec {
  const base: CableSpec =
    conductor.kind === 'metric'
      ? { kind: 'metric', areaMm2: conductor.areaMm2, conductorClass: conductor.conductorClass, coating: conductor.coating }
      : { kind: 'awg', gauge: conductor.gauge, stranding: conductor.stranding };
  return statedOhmPerKm === undefined ? base : { ...base, stated: { ohmPerKm: statedOhmPerKm } };
}

/** A catalogue driver (or, wrongly, a constant-voltage supply) as the series check takes it. */
export function ledDriverOf(product: ProductOf<'driver' | 'cv-supply'>): LedDriver {
  if (product.kind === 'cv-supply') {
    return {
      id: product.id,
      name: product.name,
      output: 'constant-voltage',
      currentA: 0,
      maxPowerW: product.spec.ratedPowerW,
      ipCode: product.spec.ipCode,
      costMinor: product.costMinor,
    };
  }
  const s = product.spec;
  const d: LedDriver = {
    id: product.id,
    name: product.name,
    output: 'constant-current',
    currentA: s.currentA,
    voltageWindowV: { minV: s.voltageWindowV.minV, maxV: s.voltageWindowV.maxV },
    maxPowerW: s.maxPowerW,
    ipCode: s.ipCode,
    costMinor: product.costMinor,
  };
  if (s.powerWindowW) d.powerWindowW = { minW: s.powerWindowW.minW, maxW: s.powerWindowW.maxW };
  if (s.efficiencyPct !== undefined) d.efficiency = s.efficiencyPct / 100;
  return d;
}

function seriesFittingOf(
  id: string,
  name: string,
  spec: FittingProductSpec,
  costMinor: number,
  location: SeriesFitting['location'],
): SeriesFitting {
  const f: SeriesFitting = {
    id,
    name,
    drive: spec.driveMode,
    ratings:
      spec.driveMode === 'constant-current'
        ? spec.ratings.map((r) => {
            const out: SeriesFitting['ratings'][number] = { currentA: r.currentA };
            if (r.forwardVoltageV !== undefined) out.forwardVoltageV = r.forwardVoltageV;
            if (r.powerW !== undefined) out.powerW = r.powerW;
            if (r.lumens !== undefined) out.lumens = r.lumens;
            return out;
          })
        : [],
    ipCode: spec.ipCode,
    unitCostMinor: costMinor,
  };
  if (location !== undefined) f.location = location;
  if (spec.tail) f.tail = { length: metres(spec.tail.lengthM), cable: cableSpecOf(spec.tail.conductor) };
  return f;
}

function ccInputs(design: CcCircuitDesign, products: readonly DesignProduct[], settings: CircuitSettings): CircuitInputs {
  const findings: Finding[] = [];
  const lookup = new ProductLookup(products, findings);

  let driver: LedDriver | null = null;
  if (design.driverProductId === null) {
    findings.push(
      finding('driver-not-chosen', 'warning', 'Choose a driver for this string, or take a suggested one.', { subject: 'driver' }),
    );
  } else {
    const p = lookup.get(design.driverProductId, ['driver', 'cv-supply'], 'driver', 'driver');
    if (p) driver = ledDriverOf(p);
  }

  let complete = true;
  const fittings: SeriesFitting[] = design.fittings.map((placement, i) => {
    const p = lookup.get(placement.productId, ['fitting'], `fitting:${i + 1}`, `fitting in position ${i + 1}`);
    if (!p) {
      complete = false;
      return { ratings: [] };
    }
    return seriesFittingOf(placement.id, placement.label || p.name, p.spec, p.costMinor, placement.location);
  });

  // One string carries one current: the fittings must agree on it, and the driver must give it.
  const currents = [...new Set(design.fittings.map((f) => f.driveCurrentA))];
  const driveCurrentA = currents.length === 1 ? currents[0]! : null;
  if (currents.length > 1) {
    findings.push(
      finding(
        'fittings-at-different-currents',
        'error',
        `The fittings are set to ${currents.map((c) => `${r2(c * 1000, 1)} mA`).join(', ')}; a series string carries one current through every fitting. Set them alike or split the string.`,
        { subject: 'string' },
      ),
    );
  }
  if (driver && driver.output === 'constant-current') {
    const off = design.fittings
      .map((f, i) => ({ f, i }))
      .filter(({ f }) => Math.abs(f.driveCurrentA - driver!.currentA) > 0.0005);
    if (off.length > 0) {
      const set = [...new Set(off.map(({ f }) => `${r2(f.driveCurrentA * 1000, 1)} mA`))].join(' / ');
      findings.push(
        finding(
          'driver-current-mismatch',
          'error',
          `This driver gives ${r2(driver.currentA * 1000, 1)} mA but ${off.length === design.fittings.length ? 'the fittings are' : `fitting${off.length > 1 ? 's' : ''} ${off.map(({ i }) => i + 1).join(', ')} ${off.length > 1 ? 'are' : 'is'}`} set to ${set}. Choose a driver of that current, or change the drive current.`,
          { subject: 'driver', values: { driverCurrentA: driver.currentA, fittingCurrentsA: set } },
        ),
      );
    }
  }

  const runs: CableRun[] = [];
  const addRun = (
    run: { cableProductId: string | null; lengthM: number },
    id: string,
    role: CableRun['role'],
    what: string,
  ): void => {
    if (run.cableProductId === null) {
      findings.push(
        finding('cable-not-chosen', 'warning', `Choose the cable for the ${what}; its drop is left out until then.`, {
          subject: `cable:${id}`,
        }),
      );
      complete = role === 'link' ? false : complete; // the block plan numbers links by position
      return;
    }
    const c = lookup.get(run.cableProductId, ['cable'], `cable:${id}`, `cable of the ${what}`);
    if (!c) {
      complete = false;
      return;
    }
    runs.push({ id, role, length: metres(run.lengthM), cable: cableSpecOf(c.spec.conductor, c.spec.statedOhmPerKm) });
  };
  if (design.driverLead) addRun(design.driverLead, 'lead', 'driver-lead', 'driver lead');
  design.links.forEach((l, k) => addRun(l, `link-${k + 1}`, 'link', `link ${k + 1}`));
  design.extensions.forEach((e, k) =>
    addRun(e, `extension-${k + 1}`, 'extension', e.label ? `extension "${e.label}"` : `extension ${k + 1}`),
  );

  let blockType: ConnectorBlockType | null = null;
  if (design.connectorBlockProductId !== null) {
    const b = lookup.get(design.connectorBlockProductId, ['connector-block'], 'blocks', 'connector block');
    if (b)
      blockType = {
        name: b.name,
        terminals: b.spec.terminals,
        cableEntries: b.spec.entries,
        conductorsPerTerminal: b.spec.conductorsPerTerminal,
        ipCode: b.spec.ipCode,
      };
  } else if (design.fittings.length > 0) {
    findings.push(
      finding('connector-block-not-chosen', 'info', 'Choose a connector block type to see the terminal schedule.', {
        subject: 'blocks',
      }),
    );
  }

  const firm =
    settings.headroomMarginPct === undefined && settings.ipOverrides === undefined
      ? undefined
      : {
          ...(settings.headroomMarginPct === undefined ? {} : { headroomMarginPct: settings.headroomMarginPct }),
          ...(settings.ipOverrides === undefined ? {} : { ipOverrides: settings.ipOverrides }),
        };
  const layout: StringLayout | null = complete
    ? { fittings, runs, driverLocation: design.driverLocation, profile: settings.profile, ...(firm ? { firm } : {}) }
    : null;
  return { kind: 'constant-current', layout, driver, blockType, assignment: design.assignment, driveCurrentA, findings };
}

function cvFittingOf(id: string, name: string, spec: FittingProductSpec, location: CvFitting['location']): CvFitting {
  const f: CvFitting = { id, name, powerW: 0, drive: spec.driveMode, ipCode: spec.ipCode };
  if (location !== undefined) f.location = location;
  if (spec.driveMode === 'constant-voltage') {
    f.powerW = spec.powerW;
    f.nominalVoltageV = spec.nominalVoltageV;
  } else {
    const r = spec.ratings[0];
    f.powerW = r ? (r.powerW ?? (r.forwardVoltageV ?? 0) * r.currentA) : 0;
  }
  return f;
}

function cvInputs(design: CvCircuitDesign, products: readonly DesignProduct[], settings: CircuitSettings): CircuitInputs {
  const findings: Finding[] = [];
  const lookup = new ProductLookup(products, findings);
  let supply: CvSupply | null = null;
  if (design.supplyProductId === null) {
    findings.push(finding('supply-not-chosen', 'warning', 'Choose a 12/24 V supply for this circuit.', { subject: 'supply' }));
  } else {
    const p = lookup.get(design.supplyProductId, ['cv-supply', 'driver'], 'supply', 'supply');
    if (p?.kind === 'cv-supply')
      supply = {
        id: p.id,
        name: p.name,
        output: 'constant-voltage',
        nominalVoltageV: p.spec.outputVoltageV,
        ratedPowerW: p.spec.ratedPowerW,
        ipCode: p.spec.ipCode,
        location: design.supplyLocation,
      };
    else if (p?.kind === 'driver')
      supply = {
        id: p.id,
        name: p.name,
        output: 'constant-current',
        nominalVoltageV: p.spec.voltageWindowV.maxV,
        ratedPowerW: p.spec.maxPowerW,
        ipCode: p.spec.ipCode,
        location: design.supplyLocation,
      };
  }
  let complete = true;
  const runs: CvRun[] = [];
  for (const run of design.runs) {
    const subject = `run:${run.id}`;
    let cable: CableSpec | null = null;
    if (run.cableProductId === null) {
      findings.push(finding('cable-not-chosen', 'warning', `Choose the cable for run "${run.label || run.id}".`, { subject }));
      complete = false;
    } else {
      const c = lookup.get(run.cableProductId, ['cable'], subject, `cable of run "${run.label || run.id}"`);
      if (c) cable = cableSpecOf(c.spec.conductor, c.spec.statedOhmPerKm);
      else complete = false;
    }
    const spans = run.fittings.map((placement, i) => {
      const p = lookup.get(
        placement.productId,
        ['fitting'],
        `${subject}/fitting:${placement.id}`,
        `fitting ${i + 1} of run "${run.label || run.id}"`,
      );
      if (!p) complete = false;
      return {
        length: metres(placement.spanLengthM),
        fitting: p
          ? cvFittingOf(placement.id, placement.label || p.name, p.spec, placement.location)
          : { id: placement.id, powerW: 0 },
      };
    });
    if (!cable) continue;
    runs.push(
      run.layout === 'hub'
        ? { id: run.id, layout: 'hub', cable, spans, feeder: { length: metres(run.feederLengthM) } }
        : { id: run.id, layout: run.layout, cable, spans },
    );
  }
  const firm =
    settings.dropLimitPct === undefined && settings.ipOverrides === undefined
      ? undefined
      : {
          ...(settings.dropLimitPct === undefined ? {} : { dropLimitPct: settings.dropLimitPct }),
          ...(settings.ipOverrides === undefined ? {} : { ipOverrides: settings.ipOverrides }),
        };
  const input: CvInput | null = supply && complete ? { supply, runs, profile: settings.profile, ...(firm ? { firm } : {}) } : null;
  return { kind: 'constant-voltage', input, findings };
}

/** Design + products -> the engine's inputs, with the design's own findings. */
export function circuitInputs(
  design: CircuitDesign,
  products: readonly DesignProduct[],
  settings: CircuitSettings,
): CircuitInputs {
  return design.kind === 'constant-current' ? ccInputs(design, products, settings) : cvInputs(design, products, settings);
}

function acknowledge(findings: readonly Finding[], acks: readonly DesignAcknowledgement[]): CircuitFinding[] {
  return findings.map((f) => {
    const ack = acks.find((a) => a.code === f.code && (a.subject ?? null) === (f.subject ?? null));
    return { ...f, acknowledged: ack ? ack.reason : null };
  });
}

function finish(
  kind: CircuitDesign['kind'],
  raw: Finding[],
  acks: readonly DesignAcknowledgement[],
  parts: Omit<CircuitEvaluation, 'kind' | 'ok' | 'blockingCount' | 'findings'>,
): CircuitEvaluation {
  const findings = acknowledge(raw, acks);
  const blockingCount = findings.filter((f) => f.severity === 'error' && f.acknowledged === null).length;
  return { kind, ok: blockingCount === 0, blockingCount, findings, ...parts };
}

/** Check a designed circuit with the engine: the same answer in the browser and on the server. */
export function evaluateCircuit(
  design: CircuitDesign,
  products: readonly DesignProduct[],
  settings: CircuitSettings,
): CircuitEvaluation {
  const inputs = circuitInputs(design, products, settings);
  const findings: Finding[] = [...inputs.findings];
  if (inputs.kind === 'constant-voltage') {
    const cv = inputs.input && inputs.input.runs.length > 0 ? checkCvRuns(inputs.input) : null;
    if (cv) findings.push(...cv.findings);
    else if (design.kind === 'constant-voltage' && design.runs.length === 0)
      findings.push(finding('cv-run-empty', 'warning', 'Add a run of fittings to this supply.', { subject: 'supply' }));
    return finish('constant-voltage', findings, design.acknowledgements, {
      series: null,
      preview: null,
      blocks: null,
      wiring: null,
      cv,
    });
  }

  const { layout, driver, blockType } = inputs;
  let series: SeriesStringResult | null = null;
  let preview: StringPreview | null = null;
  if (layout && layout.fittings.length === 0) {
    findings.push(finding('string-empty', 'warning', 'Add the fittings of this string in wiring order.', { subject: 'string' }));
  } else if (layout && driver) {
    series = checkSeriesString({ ...layout, driver });
    findings.push(...series.findings);
  } else if (layout && inputs.driveCurrentA !== null) {
    const option = compareDriveCurrents(layout, [inputs.driveCurrentA], [])[0];
    if (option) {
      const { driver: _none, ...rest } = option;
      preview = rest;
      findings.push(...option.findings);
    }
  }

  let blocks: BlockPlan | null = null;
  let wiring: WiringCheckResult | null = null;
  if (layout && blockType && layout.fittings.length > 0) {
    blocks = planConnectorBlocks({
      string: blockLayoutFromSeries(layout),
      blockType,
      ...(inputs.assignment ? { assignment: inputs.assignment } : {}),
    });
    findings.push(...blocks.findings);
    if (blocks.blocks.length > 0) {
      wiring = checkWiring(blocks);
      findings.push(...wiring.findings);
    }
  }
  return finish('constant-current', findings, design.acknowledgements, { series, preview, blocks, wiring, cv: null });
}
