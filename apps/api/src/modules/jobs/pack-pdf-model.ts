import {
  PICK_PLACE_LABELS,
  QUOTE_STATUS_LABELS,
  type JobPackResponse,
  type JudgedReading,
  type PickItem,
} from '@gloaming/contracts';
import type { Organization, Quote } from '@gloaming/db';
import {
  describeConductorEnd,
  parseConductorEnd,
  type CircuitEvaluation,
  type CvCircuitDesign,
  type CvResult,
} from '@gloaming/engine';
import type { InstallerPackPdfModel, PackPdfCircuit, PackPdfRunDiagram, PackPdfTable } from '../quote-pdf/installer-pack-model';

const num = (x: number, digits = 2) => String(Math.round(x * 10 ** digits) / 10 ** digits);

function quantity(item: PickItem): string {
  return item.unit === 'each' ? String(item.quantity) : `${num(item.quantity)} ${item.unit}`;
}

function readingRange(r: JudgedReading): string {
  if (r.min !== null && r.max !== null) return `${num(r.min)}–${num(r.max)} ${r.unit}`;
  if (r.min !== null) return `at least ${num(r.min)} ${r.unit}`;
  if (r.max !== null) return `at most ${num(r.max)} ${r.unit}`;
  return '';
}

function endWords(text: string, labels: readonly string[]): string {
  const end = parseConductorEnd(text);
  return end ? describeConductorEnd(end, labels).replace(/ -$/, ' −') : text;
}

const LAYOUT_WORDS: Record<CvCircuitDesign['runs'][number]['layout'], string> = {
  'daisy-chain': 'daisy chain',
  'home-run': 'home runs',
  hub: 'hub',
};

/** The run diagram's words and figures, as the workbench's run diagram shows them. */
function runDiagramOf(design: CvCircuitDesign, cv: CvResult, supplyName: string): PackPdfRunDiagram | null {
  const runs = cv.runs.flatMap((r) => {
    const d = design.runs.find((x) => x.id === r.id);
    if (!d || r.fittings.length === 0) return [];
    const span = (m: number) =>
      d.layout === 'hub' ? `spoke ${num(m, 1)} m` : d.layout === 'home-run' ? `own ${num(m, 1)} m` : `${num(m, 1)} m`;
    return [
      {
        title: `Run: ${d.label || d.id} · ${LAYOUT_WORDS[d.layout]} · ${r.currentA.toFixed(2)} A`,
        lead: d.layout === 'hub' ? `feeder ${num(d.feederLengthM, 1)} m` : d.layout === 'home-run' ? 'at the supply' : '',
        hub: d.layout === 'hub',
        alongPair: d.layout === 'daisy-chain',
        fittings: r.fittings.map((f, k) => {
          const low = !f.withinDropLimit || !f.aboveOwnMinimum;
          const placement = d.fittings[k];
          return {
            number: String(f.position),
            label: placement?.label || `Fitting ${k + 1}`,
            span: placement ? span(placement.spanLengthM) : '',
            voltage: `${f.voltageV.toFixed(2)} V`,
            // the PDF font has no ✕: the page's mark is spelled out
            drop: `${low ? 'LOW · ' : ''}drop ${f.dropPct.toFixed(1)} %`,
            low,
          };
        }),
      },
    ];
  });
  if (runs.length === 0) return null;
  return {
    supplyName,
    nominal: `${num(cv.nominalVoltageV)} V`,
    legend: `V at each fitting · drop from ${num(cv.nominalVoltageV)} V (limit ${num(cv.dropLimitPct, 1)} %)`,
    runs,
  };
}

export function installerPackFileName(reference: string): string {
  return `${reference}-installers-pack.pdf`;
}

/** The PDF's model from the pack the page shows and the circuits' evaluations. */
export function buildInstallerPackPdfModel(
  pack: JobPackResponse,
  quote: Quote,
  evaluations: ReadonlyMap<string, CircuitEvaluation>,
  now = new Date(),
): InstallerPackPdfModel {
  const firm = quote.organization as Organization;
  const date = new Intl.DateTimeFormat(firm.locale || 'en-GB', {
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    timeZone: 'UTC',
  });
  const loads: PackPdfTable[] = [];
  for (const g of pack.loads) {
    loads.push({
      title: PICK_PLACE_LABELS[g.place],
      head: ['Item', 'Code', 'Quantity'],
      rows: g.items.map((i) => [i.name, i.code, quantity(i)]),
    });
    if (g.cuts.length > 0) {
      loads.push({
        title: 'Cable cuts (run plus slack, rounded up to 0.1 m)',
        head: ['Circuit', 'Run', 'Cable', 'Run m', 'Cut m'],
        rows: g.cuts.map((c) => [c.circuit, c.label, c.name, num(c.runM), num(c.cutM, 1)]),
      });
      loads.push({
        title: 'Cable to take, per type',
        head: ['Cable', 'Code', 'Total cut'],
        rows: g.cableTotals.map((t) => [t.name, t.code, `${num(t.totalM, 1)} m`]),
      });
    }
  }
  const circuits: PackPdfCircuit[] = pack.circuits.map((c) => {
    const evaluation = evaluations.get(c.id);
    const plan = evaluation?.blocks ?? null;
    const labels = plan?.fittingLabels ?? [];
    const fittings =
      c.design.kind === 'constant-current' ? c.design.fittings.length : c.design.runs.reduce((n, r) => n + r.fittings.length, 0);
    const cv = evaluation?.cv ?? null;
    return {
      title: c.name ? `${c.area}: ${c.name}` : c.area,
      kind: c.kind === 'constant-current' ? 'Constant current, series string' : 'Constant voltage, parallel runs',
      power: c.powerName || 'No driver chosen',
      summary:
        `${fittings} fitting${fittings === 1 ? '' : 's'}` +
        (plan ? `, ${plan.blocks.length} connector block${plan.blocks.length === 1 ? '' : 's'}` : '') +
        (c.designOk ? '' : '. The design check has unresolved errors: ask the estimator before fitting.'),
      diagram:
        plan && plan.blocks.length > 0
          ? {
              driverName: c.powerName,
              blocks: plan.blocks.map((b) => ({ number: b.number, fittings: b.fittings })),
              links: plan.links.map((l) => ({ number: l.number, lengthM: l.lengthM })),
              fittingLabels: plan.fittingLabels,
            }
          : null,
      runDiagram:
        cv && c.design.kind === 'constant-voltage' ? runDiagramOf(c.design, cv, c.powerName || 'No supply chosen') : null,
      schedules: (plan?.blocks ?? []).map((b) => ({
        title: `Block ${b.number}: ${b.blockType} (${b.ipCode}), fittings ${b.fittings.join(', ')}; ${b.entries.seals} seals, ${b.entries.blankingPlugs} blanking plugs`,
        head: ['Terminal', 'Conductor ends landed', 'Joint'],
        rows: b.terminals.map((t, i) => [
          `T${i + 1}`,
          t.conductors.map((e) => `${e}  ${endWords(e, labels)}`).join('\n'),
          t.note ?? '',
        ]),
      })),
      steps: plan?.steps.map((s) => s.text) ?? [],
      runs: cv
        ? {
            title: `Runs at ${num(cv.nominalVoltageV)} V nominal`,
            head: ['Run', 'Fitting', 'Expected V', 'Drop %'],
            rows: cv.runs.flatMap((r) => {
              const run = c.design.kind === 'constant-voltage' ? c.design.runs.find((x) => x.id === r.id) : undefined;
              return r.fittings.map((f, k) => [
                run?.label || r.id,
                run?.fittings[k]?.label || `fitting ${k + 1}`,
                num(f.voltageV),
                num(f.dropPct, 1),
              ]);
            }),
          }
        : null,
      pick: {
        title: 'Pick list for this circuit',
        head: ['Item', 'Code', 'Quantity', 'Where'],
        rows: [
          ...c.pick.items.map((i) => [i.name, i.code, quantity(i), i.place === 'bench' ? 'Bench' : 'Van']),
          ...c.pick.cuts.map((k) => [`${k.name}: ${k.label}`, k.code, `cut ${num(k.cutM, 1)} m`, 'Bench']),
        ],
      },
      readings: c.commissioning.readings.map((r) => ({
        label: r.label,
        expected: r.expected === null ? '' : `${num(r.expected)} ${r.unit}`,
        range: readingRange(r),
        measured: r.value === null ? '' : `${num(r.value, 3)} ${r.unit}`,
        flag: r.status === 'low' ? 'LOW' : r.status === 'high' ? 'HIGH' : '',
      })),
      checks: c.commissioning.checks.map((k) => ({ label: k.label, done: k.done })),
      note: c.commissioning.note,
      asWired: c.asWired
        ? {
            safe: c.asWired.advice.safeToPowerUp,
            lines: c.asWired.advice.safeToPowerUp
              ? [
                  c.asWired.advice.differences.length
                    ? `Wired differently from the design at ${c.asWired.advice.differences.length} terminal(s); the check passes.`
                    : 'Wired as designed; the check passes.',
                ]
              : c.asWired.advice.changes.map((ch) => ch.message),
          }
        : null,
    };
  });
  return {
    firmName: firm.name,
    reference: pack.job.reference,
    title: pack.job.title,
    revision: pack.job.revisionNumber,
    status: QUOTE_STATUS_LABELS[pack.job.status],
    printedOn: date.format(now),
    customer: { name: pack.job.customerName, phone: pack.job.customerPhone },
    site: {
      label: pack.job.siteLabel,
      lines: [...pack.job.siteAddress, pack.job.postcode].filter(Boolean),
      accessNotes: pack.job.accessNotes,
    },
    caution: pack.caution,
    loads,
    circuits,
  };
}
