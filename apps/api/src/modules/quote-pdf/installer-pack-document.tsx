import { Canvas, Circle, Document, Font, G, Line, Page, Rect, StyleSheet, Svg, Text, View } from '@react-pdf/renderer';
import { Fragment } from 'react';
import { PDF_FONT } from './fonts';
import type {
  InstallerPackPdfModel,
  PackPdfCircuit,
  PackPdfDiagram,
  PackPdfRunDiagram,
  PackPdfTable,
} from './installer-pack-model';

/** The installer's pack: the quote's dusk blue and lamp amber, sized for a clipboard on site. */
const ink = '#1b2552';
const muted = '#5a607a';
const rule = '#dcdfe9';
const wash = '#f3f5fc';
const lamp = '#b86c0c';
const lampWash = '#fff8ec';
const alarm = '#a3261b';

const FOOTER_SIZE = 7.5;

const s = StyleSheet.create({
  page: { fontFamily: PDF_FONT, fontSize: 9, color: ink, paddingTop: 36, paddingBottom: 52, paddingHorizontal: 40 },
  header: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start' },
  firm: { fontSize: 14, fontWeight: 700 },
  docTitle: { fontSize: 18, fontWeight: 600, textAlign: 'right' },
  muted: { color: muted },
  accent: { height: 3, backgroundColor: lamp, width: 64, marginTop: 10, marginBottom: 12 },
  caution: {
    borderWidth: 1,
    borderColor: lamp,
    backgroundColor: lampWash,
    borderRadius: 4,
    padding: 8,
    marginBottom: 12,
  },
  cautionTitle: { fontWeight: 700, marginBottom: 2 },
  parties: { flexDirection: 'row', gap: 12, marginBottom: 12 },
  party: { flex: 1, backgroundColor: wash, borderRadius: 4, padding: 8 },
  label: { fontSize: 7.5, fontWeight: 600, color: muted, textTransform: 'uppercase', letterSpacing: 0.6, marginBottom: 3 },
  h2: { fontSize: 13, fontWeight: 700, marginTop: 6, marginBottom: 6 },
  h3: { fontSize: 10, fontWeight: 600, marginTop: 8, marginBottom: 3 },
  table: { marginBottom: 6 },
  head: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: ink, paddingBottom: 2 },
  headCell: { fontSize: 7.5, fontWeight: 600, color: muted, textTransform: 'uppercase', letterSpacing: 0.4 },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: rule, paddingVertical: 3 },
  step: { flexDirection: 'row', marginBottom: 3 },
  stepNo: { width: 16, color: muted },
  readingRow: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: rule, paddingVertical: 5, alignItems: 'center' },
  box: {
    width: 70,
    height: 14,
    borderWidth: 0.75,
    borderColor: muted,
    borderRadius: 2,
    paddingHorizontal: 3,
    justifyContent: 'center',
  },
  flag: { color: alarm, fontWeight: 700, width: 34, textAlign: 'center' },
  tick: {
    width: 10,
    height: 10,
    borderWidth: 0.75,
    borderColor: ink,
    marginRight: 6,
    alignItems: 'center',
    justifyContent: 'center',
  },
  checkRow: { flexDirection: 'row', alignItems: 'center', marginBottom: 4 },
  wiredSafe: { borderLeftWidth: 3, borderLeftColor: ink, paddingLeft: 6, marginTop: 4 },
  wiredUnsafe: { borderLeftWidth: 3, borderLeftColor: alarm, paddingLeft: 6, marginTop: 4 },
  footer: { position: 'absolute', bottom: 24, left: 40, right: 40, height: FOOTER_SIZE * 1.3 },
  totalProbe: { position: 'absolute', top: 0, left: 0, width: 0, height: 0 },
});

/** Column widths: the first column takes what the others leave. */
function widths(head: readonly string[]): (number | undefined)[] {
  const fixed: Record<string, number> = {
    Terminal: 46,
    Joint: 140,
    Code: 70,
    Quantity: 64,
    Where: 40,
    'Run m': 40,
    'Cut m': 40,
    'Total cut': 60,
    'Expected V': 60,
    'Drop %': 44,
    Circuit: 110,
    Cable: 120,
  };
  return head.map((h, i) => (i === 0 && !(h in fixed) ? undefined : fixed[h]));
}

function Table({ table }: { table: PackPdfTable }) {
  // one plain style object a column (react-pdf flattens a style array again for every cell)
  const cells = widths(table.head).map((w) => (w === undefined ? { paddingRight: 6, flex: 1 } : { paddingRight: 6, width: w }));
  const heads = cells.map((c) => ({ ...c, ...s.headCell }));
  return (
    <View style={s.table}>
      <Text style={s.h3}>{table.title}</Text>
      <View style={s.head}>
        {table.head.map((h, i) => (
          <Text key={h} style={heads[i]}>
            {h}
          </Text>
        ))}
      </View>
      {table.rows.map((row, r) => (
        <View key={r} style={s.row} wrap={false}>
          {row.map((c, i) => (
            <Text key={i} style={cells[i]}>
              {c}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

const FIT_W = 48;
const BLOCK_GAP = 56;
const TOP = 34;
const BLOCK_H = 60;
const FWD_Y = 54;
const RET_Y = 82;
const FIT_Y = 150;
const svgFont = { fontFamily: PDF_FONT, fontSize: 9 };

/**
 * The string diagram with react-pdf's Svg primitives, in the designer's visual language:
 * driver, blocks with their fittings, the + string solid, the return leg dashed and marked −,
 * links between blocks. Polarity is in the marks and line style, never in colour alone.
 */
function Diagram({ d }: { d: PackPdfDiagram }) {
  const ws = d.blocks.map((b) => Math.max(100, b.fittings.length * FIT_W + 16));
  const xs: number[] = [];
  let x = 120;
  for (const w of ws) {
    xs.push(x);
    x += w + BLOCK_GAP;
  }
  const width = x - BLOCK_GAP + 10;
  const height = FIT_Y + 40;
  const shown = Math.min(515, width);
  return (
    <Svg viewBox={`0 0 ${width} ${height}`} style={{ width: shown, height: (shown * height) / width, marginVertical: 4 }}>
      <G {...svgFont}>
        <Line x1={6} y1={10} x2={30} y2={10} stroke={ink} strokeWidth={2.2} />
        <Text x={34} y={13} fill={ink}>
          + string (forward)
        </Text>
        <Line x1={130} y1={10} x2={154} y2={10} stroke={ink} strokeWidth={1.8} strokeDasharray="5 3" />
        <Text x={158} y={13} fill={ink}>
          − return leg
        </Text>
        <Rect x={6} y={TOP} width={84} height={BLOCK_H} rx={5} fill="none" stroke={ink} strokeWidth={1.8} />
        <Text x={48} y={TOP + 18} fill={ink} textAnchor="middle">
          Driver
        </Text>
        <Text x={48} y={TOP + 32} fill={muted} textAnchor="middle">
          {d.driverName.length > 16 ? `${d.driverName.slice(0, 15)}…` : d.driverName}
        </Text>
        <Text x={84} y={FWD_Y + 3} fill={ink} textAnchor="end">
          +
        </Text>
        <Text x={84} y={RET_Y + 3} fill={ink} textAnchor="end">
          −
        </Text>
        <Line x1={90} y1={FWD_Y} x2={xs[0]!} y2={FWD_Y} stroke={ink} strokeWidth={2.2} />
        <Line x1={90} y1={RET_Y} x2={xs[0]!} y2={RET_Y} stroke={ink} strokeWidth={1.8} strokeDasharray="5 3" />
        {d.blocks.map((b, j) => {
          const bx = xs[j]!;
          const bw = ws[j]!;
          const next = xs[j + 1];
          const link = d.links[j];
          return (
            <Fragment key={b.number}>
              <Rect x={bx} y={TOP} width={bw} height={BLOCK_H} rx={3} fill="none" stroke={ink} strokeWidth={1.8} />
              <Text x={bx + 5} y={TOP + 12} fill={ink}>
                {`Block ${b.number}`}
              </Text>
              <Line x1={bx} y1={RET_Y} x2={bx + bw} y2={RET_Y} stroke={ink} strokeWidth={1.8} strokeDasharray="5 3" />
              {b.fittings.map((n, k) => {
                const fx = bx + 16 + k * FIT_W + FIT_W / 2 - 8;
                const label = d.fittingLabels[n - 1] ?? '';
                return (
                  <Fragment key={n}>
                    <Line x1={fx - 6} y1={TOP + BLOCK_H} x2={fx - 6} y2={FIT_Y - 11} stroke={ink} strokeWidth={1.5} />
                    <Line
                      x1={fx + 6}
                      y1={TOP + BLOCK_H}
                      x2={fx + 6}
                      y2={FIT_Y - 11}
                      stroke={ink}
                      strokeWidth={1.5}
                      strokeDasharray="3 2"
                    />
                    <Text x={fx - 9} y={FIT_Y - 15} fill={ink} textAnchor="end">
                      +
                    </Text>
                    <Text x={fx + 9} y={FIT_Y - 15} fill={ink}>
                      −
                    </Text>
                    <Circle cx={fx} cy={FIT_Y} r={11} fill="none" stroke={ink} strokeWidth={1.8} />
                    <Text x={fx} y={FIT_Y + 3} fill={ink} textAnchor="middle">
                      {String(n)}
                    </Text>
                    <Text x={fx} y={FIT_Y + 24} fill={muted} textAnchor="middle">
                      {label.length > 10 ? `${label.slice(0, 9)}…` : label}
                    </Text>
                  </Fragment>
                );
              })}
              {next !== undefined && (
                <>
                  <Line x1={bx + bw} y1={FWD_Y} x2={next} y2={FWD_Y} stroke={ink} strokeWidth={2.2} />
                  <Line x1={bx + bw} y1={RET_Y} x2={next} y2={RET_Y} stroke={ink} strokeWidth={1.8} strokeDasharray="5 3" />
                  <Text x={(bx + bw + next) / 2} y={FWD_Y - 5} fill={muted} textAnchor="middle">
                    {`link ${link?.number ?? j + 1}${link?.lengthM ? ` · ${link.lengthM} m` : ''}`}
                  </Text>
                </>
              )}
            </Fragment>
          );
        })}
      </G>
    </Svg>
  );
}

const RUN_FIT_W = 80;
const SUPPLY_W = 92;
const BUS_X = 160;
const ROW_H = 146;
const RUN_TOP = 28;
const POS_DY = 32;
const NEG_DY = 54;
const FIT_DY = 96;

/**
 * A constant-voltage circuit's run diagram with react-pdf's Svg primitives, as the workbench
 * draws it: the supply, each run's pair (+ solid and marked +, − dashed and marked −) with its
 * cable segments, the fittings across the pair in parallel with the voltage and drop at each.
 * A fitting past the limit is marked LOW in words and a heavier dashed ring, never by colour.
 */
function RunDiagram({ d }: { d: PackPdfRunDiagram }) {
  const most = Math.max(...d.runs.map((r) => r.fittings.length));
  const width = Math.max(BUS_X + 30 + most * RUN_FIT_W + 10, 470);
  const height = RUN_TOP + d.runs.length * ROW_H + 6;
  const shown = Math.min(515, width);
  const supplyX = 6;
  const supplyRight = supplyX + SUPPLY_W;
  return (
    <Svg viewBox={`0 0 ${width} ${height}`} style={{ width: shown, height: (shown * height) / width, marginVertical: 4 }}>
      <G {...svgFont}>
        <Line x1={6} y1={10} x2={30} y2={10} stroke={ink} strokeWidth={2.2} />
        <Text x={34} y={13} fill={ink}>
          + conductor
        </Text>
        <Line x1={110} y1={10} x2={134} y2={10} stroke={ink} strokeWidth={1.8} strokeDasharray="5 3" />
        <Text x={138} y={13} fill={ink}>
          − conductor
        </Text>
        <Text x={220} y={13} fill={muted}>
          {d.legend}
        </Text>
        <Rect
          x={supplyX}
          y={RUN_TOP + POS_DY - 20}
          width={SUPPLY_W}
          height={(d.runs.length - 1) * ROW_H + (NEG_DY - POS_DY) + 40}
          rx={5}
          fill="none"
          stroke={ink}
          strokeWidth={1.8}
        />
        <Text x={supplyX + SUPPLY_W / 2} y={RUN_TOP + POS_DY - 5} fill={ink} textAnchor="middle">
          Supply
        </Text>
        <Text x={supplyX + SUPPLY_W / 2} y={RUN_TOP + POS_DY + 8} fill={muted} textAnchor="middle">
          {d.supplyName.length > 15 ? `${d.supplyName.slice(0, 14)}…` : d.supplyName}
        </Text>
        <Text x={supplyX + SUPPLY_W / 2} y={RUN_TOP + NEG_DY + 8} fill={ink} textAnchor="middle">
          {d.nominal}
        </Text>
        {d.runs.map((run, i) => {
          const y0 = RUN_TOP + i * ROW_H;
          const pos = y0 + POS_DY;
          const neg = y0 + NEG_DY;
          const fitY = y0 + FIT_DY;
          const xs = run.fittings.map((_, k) => BUS_X + 30 + k * RUN_FIT_W + RUN_FIT_W / 2);
          const lastX = xs.at(-1)!;
          return (
            <Fragment key={i}>
              <Text x={BUS_X - 40} y={y0 + 10} fill={ink}>
                {run.title}
              </Text>
              <Text x={supplyRight - 5} y={pos + 3} fill={ink} textAnchor="end">
                +
              </Text>
              <Text x={supplyRight - 5} y={neg + 3} fill={ink} textAnchor="end">
                −
              </Text>
              <Line x1={supplyRight} y1={pos} x2={lastX - 6} y2={pos} stroke={ink} strokeWidth={2.2} />
              <Line x1={supplyRight} y1={neg} x2={lastX + 6} y2={neg} stroke={ink} strokeWidth={1.8} strokeDasharray="5 3" />
              {run.lead ? (
                <Text x={(supplyRight + BUS_X) / 2} y={pos - 5} fill={muted} textAnchor="middle">
                  {run.lead}
                </Text>
              ) : null}
              {run.hub ? (
                <>
                  <Rect x={BUS_X} y={pos - 7} width={12} height={neg - pos + 14} fill="white" stroke={ink} strokeWidth={1.3} />
                  <Text x={BUS_X + 6} y={neg + 17} fill={muted} textAnchor="middle">
                    junction
                  </Text>
                </>
              ) : null}
              {run.fittings.map((f, k) => {
                const fx = xs[k]!;
                const prevX = k === 0 ? BUS_X : xs[k - 1]!;
                return (
                  <Fragment key={k}>
                    {run.alongPair ? (
                      <Text x={(prevX + fx) / 2} y={pos - 5} fill={muted} textAnchor="middle">
                        {f.span}
                      </Text>
                    ) : (
                      <Text x={fx + 9} y={neg + 11} fill={muted}>
                        {f.span}
                      </Text>
                    )}
                    <Line x1={fx - 6} y1={pos} x2={fx - 6} y2={fitY - 11} stroke={ink} strokeWidth={1.5} />
                    <Line x1={fx + 6} y1={neg} x2={fx + 6} y2={fitY - 11} stroke={ink} strokeWidth={1.5} strokeDasharray="3 2" />
                    <Circle cx={fx - 6} cy={pos} r={2.2} fill={ink} />
                    <Circle cx={fx + 6} cy={neg} r={2.2} fill={ink} />
                    <Text x={fx - 9} y={fitY - 14} fill={ink} textAnchor="end">
                      +
                    </Text>
                    <Text x={fx + 9} y={fitY - 14} fill={ink}>
                      −
                    </Text>
                    <Circle
                      cx={fx}
                      cy={fitY}
                      r={11}
                      fill="none"
                      stroke={ink}
                      strokeWidth={f.low ? 2.6 : 1.8}
                      {...(f.low ? { strokeDasharray: '3 2' } : {})}
                    />
                    <Text x={fx} y={fitY + 3} fill={ink} textAnchor="middle">
                      {f.number}
                    </Text>
                    <Text x={fx} y={fitY + 22} fill={muted} textAnchor="middle">
                      {f.label.length > 14 ? `${f.label.slice(0, 13)}…` : f.label}
                    </Text>
                    <Text x={fx} y={fitY + 33} fill={ink} textAnchor="middle">
                      {f.voltage}
                    </Text>
                    <Text x={fx} y={fitY + 44} fill={f.low ? alarm : muted} textAnchor="middle">
                      {f.drop}
                    </Text>
                  </Fragment>
                );
              })}
            </Fragment>
          );
        })}
      </G>
    </Svg>
  );
}

function CircuitSection({ c, index }: { c: PackPdfCircuit; index: number }) {
  return (
    <View>
      <Text style={s.h2}>{`Circuit ${index + 1}. ${c.title}`}</Text>
      <Text style={s.muted}>{`${c.kind} · ${c.power} · ${c.summary}`}</Text>
      {c.diagram && <Diagram d={c.diagram} />}
      {c.runDiagram && <RunDiagram d={c.runDiagram} />}
      <Table table={c.pick} />
      {c.runs && <Table table={c.runs} />}
      {c.schedules.map((t) => (
        <Table key={t.title} table={t} />
      ))}
      {c.steps.length > 0 && (
        <View wrap>
          <Text style={s.h3}>Installer’s steps</Text>
          {c.steps.map((step, i) => (
            <View key={i} style={s.step} wrap={false}>
              <Text style={s.stepNo}>{`${i + 1}.`}</Text>
              <Text style={{ flex: 1 }}>{step}</Text>
            </View>
          ))}
        </View>
      )}
      {c.asWired && (
        <View style={c.asWired.safe ? s.wiredSafe : s.wiredUnsafe} wrap={false}>
          <Text style={s.h3}>{c.asWired.safe ? 'As wired: safe to power up' : 'As wired: NOT safe to power up. Change:'}</Text>
          {c.asWired.lines.map((l, i) => (
            <Text key={i}>{`• ${l}`}</Text>
          ))}
        </View>
      )}
      <View wrap={false}>
        <Text style={s.h3}>Commissioning</Text>
        <View style={s.head}>
          <Text style={[s.headCell, { flex: 1 }]}>Reading</Text>
          <Text style={[s.headCell, { width: 60 }]}>Expected</Text>
          <Text style={[s.headCell, { width: 80 }]}>Range</Text>
          <Text style={[s.headCell, { width: 70 }]}>Measured</Text>
          <Text style={[s.headCell, { width: 34 }]}> </Text>
        </View>
        {c.readings.map((r) => (
          <View key={r.label} style={s.readingRow}>
            <Text style={{ flex: 1, paddingRight: 6 }}>{r.label}</Text>
            <Text style={{ width: 60 }}>{r.expected}</Text>
            <Text style={{ width: 80 }}>{r.range}</Text>
            <View style={s.box}>
              <Text>{r.measured}</Text>
            </View>
            <Text style={s.flag}>{r.flag}</Text>
          </View>
        ))}
        <View style={{ marginTop: 6 }}>
          {c.checks.map((k) => (
            <View key={k.label} style={s.checkRow}>
              <View style={[s.tick, k.done ? { backgroundColor: ink } : {}]} />
              <Text style={{ flex: 1 }}>{k.done ? `${k.label} (done)` : k.label}</Text>
            </View>
          ))}
        </View>
        {c.note ? <Text style={s.muted}>{`Note: ${c.note}`}</Text> : null}
      </View>
    </View>
  );
}

/**
 * Page numbers without a render prop: react-pdf lays a page out again for every page that holds
 * a render prop, once while splitting and once more for the totals (on this pack that was a
 * third of the render). So the footer is a fixed Canvas painted while the PDF is written, when
 * every page is laid out: pages are written in order, so the n-th paint is page n, and the total
 * comes from one render-prop probe on the document's last page element (each page element is at
 * most a few pages, so its relayouts are cheap).
 */
interface PageNumbering {
  total: number;
  painted: number;
}

function Footer({ reference, numbering }: { reference: string; numbering: PageNumbering }) {
  return (
    <Canvas
      style={s.footer}
      fixed
      paint={(painter: FooterPainter) => {
        numbering.painted += 1;
        if (numbering.total < numbering.painted) throw new Error('The page count was not known when the footer was painted.');
        const font = Font.getFont({ fontFamily: PDF_FONT, fontWeight: 400 }).data;
        if (!font) throw new Error('The footer font is not loaded.');
        painter
          .font(font)
          .fontSize(FOOTER_SIZE)
          .fillColor(muted)
          .text(`${reference} installer’s pack · no prices · page ${numbering.painted} of ${numbering.total}`, 0, 0, {
            lineBreak: false,
          });
        return null;
      }}
    />
  );
}

/** The part of pdfkit's document a Canvas painter exposes that the footer uses. */
interface FooterPainter {
  font(font: unknown): FooterPainter;
  fontSize(size: number): FooterPainter;
  fillColor(color: string): FooterPainter;
  text(text: string, x: number, y: number, options: { lineBreak: boolean }): FooterPainter;
}

/** Records the document's page count for the footers; draws nothing. */
function PageTotalProbe({ numbering }: { numbering: PageNumbering }) {
  return (
    <Text
      style={s.totalProbe}
      fixed
      render={({ totalPages }) => {
        if (totalPages) numbering.total = totalPages;
        return '';
      }}
    />
  );
}

export function InstallerPackDocument({ model }: { model: InstallerPackPdfModel }) {
  const numbering: PageNumbering = { total: 0, painted: 0 };
  const last = model.circuits.length - 1;
  return (
    <Document
      title={`${model.reference} installer’s pack`}
      author={model.firmName}
      subject={`Installer’s pack for ${model.title || model.reference}`}
      creator="Gloaming"
      producer="Gloaming"
    >
      <Page size="A4" style={s.page}>
        <View style={s.header}>
          <View>
            <Text style={s.firm}>{model.firmName}</Text>
            <Text style={s.muted}>{`Printed ${model.printedOn}`}</Text>
          </View>
          <View>
            <Text style={s.docTitle}>Installer’s pack</Text>
            <Text
              style={[s.muted, { textAlign: 'right' }]}
            >{`${model.reference} · revision ${model.revision} · ${model.status}`}</Text>
          </View>
        </View>
        <View style={s.accent} />
        <View style={s.caution}>
          <Text style={s.cautionTitle}>Electrical caution</Text>
          <Text>{model.caution}</Text>
        </View>
        <View style={s.parties}>
          <View style={s.party}>
            <Text style={s.label}>Job</Text>
            <Text style={{ fontWeight: 600 }}>{model.title || model.reference}</Text>
            <Text>{model.customer.name}</Text>
            {model.customer.phone ? <Text>{model.customer.phone}</Text> : null}
          </View>
          <View style={s.party}>
            <Text style={s.label}>Site</Text>
            {model.site.label ? <Text style={{ fontWeight: 600 }}>{model.site.label}</Text> : null}
            {model.site.lines.map((l) => (
              <Text key={l}>{l}</Text>
            ))}
            {model.site.accessNotes ? <Text style={s.muted}>{`Access: ${model.site.accessNotes}`}</Text> : null}
          </View>
        </View>
        <Text style={s.h2}>Pick list: what to load</Text>
        {model.loads.map((t) => (
          <Table key={t.title} table={t} />
        ))}
        {model.circuits.length === 0 && <Text style={s.muted}>This job has no circuits designed yet.</Text>}
        <Footer reference={model.reference} numbering={numbering} />
        {last < 0 && <PageTotalProbe numbering={numbering} />}
      </Page>
      {model.circuits.map((c, i) => (
        <Page key={i} size="A4" style={s.page}>
          <CircuitSection c={c} index={i} />
          <Footer reference={model.reference} numbering={numbering} />
          {i === last && <PageTotalProbe numbering={numbering} />}
        </Page>
      ))}
    </Document>
  );
}
