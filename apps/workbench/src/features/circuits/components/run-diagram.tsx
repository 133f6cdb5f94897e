import type { CvCircuitDesign, CvResult, CvRunDesign, CvRunResult } from '@gloaming/engine';

const FIT_W = 96;
const SUPPLY_W = 110;
const BUS_X = 190;
const ROW_H = 164;
const TOP = 34;
/** Within a run's row: the title, the + conductor, the − conductor, the fittings. */
const TITLE_DY = 14;
const POS_DY = 38;
const NEG_DY = 62;
const FIT_DY = 104;

const LAYOUT_WORDS: Record<CvRunDesign['layout'], string> = {
  'daisy-chain': 'daisy chain',
  'home-run': 'home runs',
  hub: 'hub',
};

const clip = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);
const metres = (m: number) => `${Math.round(m * 10) / 10} m`;

/** What one span of cable is, in the installer's words, for the layout of its run. */
function spanWords(layout: CvRunDesign['layout'], lengthM: number): string {
  if (layout === 'hub') return `spoke ${metres(lengthM)}`;
  if (layout === 'home-run') return `own ${metres(lengthM)}`;
  return metres(lengthM);
}

interface Row {
  design: CvRunDesign;
  result: CvRunResult;
}

/**
 * A constant-voltage circuit drawn from its check: the supply, each run with its cable
 * segments (daisy-chain spans along the pair; a hub's feeder then a spoke to each fitting; a
 * home run's own cable per fitting), the fittings across the pair in parallel, and the voltage
 * and drop at each. The + conductor is solid and marked +, the − conductor dashed and marked −;
 * a fitting below the drop limit or its own minimum is marked in words. Polarity and problems
 * are in the marks, labels and line style, never in colour alone.
 */
export function RunDiagram({ design, cv, supplyName }: { design: CvCircuitDesign; cv: CvResult; supplyName: string }) {
  const rows: Row[] = cv.runs.flatMap((result) => {
    const d = design.runs.find((r) => r.id === result.id);
    return d && result.fittings.length > 0 ? [{ design: d, result }] : [];
  });
  if (rows.length === 0) return null;
  const most = Math.max(...rows.map((r) => r.result.fittings.length));
  const width = BUS_X + 40 + most * FIT_W + 20;
  const height = TOP + rows.length * ROW_H + 20;
  const fittingCount = rows.reduce((n, r) => n + r.result.fittings.length, 0);
  return (
    <svg
      role="img"
      aria-labelledby="run-diagram-title"
      viewBox={`0 0 ${width} ${height}`}
      width={width}
      height={height}
      className="max-w-none text-ink"
    >
      <title id="run-diagram-title">
        {`Wiring diagram: ${supplyName} at ${cv.nominalVoltageV} V feeds ${fittingCount} fitting${fittingCount === 1 ? '' : 's'} in parallel on ${rows.length} run${rows.length === 1 ? '' : 's'}; each fitting shows the voltage expected across it.`}
      </title>
      {/* legend */}
      <g fontSize="11" fill="currentColor">
        <line x1="10" y1="14" x2="40" y2="14" stroke="currentColor" strokeWidth="2.5" />
        <text x="46" y="18">
          + conductor
        </text>
        <line x1="150" y1="14" x2="180" y2="14" stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
        <text x="186" y="18">
          − conductor
        </text>
        <text x="300" y="18">
          {`V at each fitting · drop from ${cv.nominalVoltageV} V (limit ${cv.dropLimitPct} %)`}
        </text>
      </g>
      {/* supply */}
      <rect
        x="10"
        y={TOP + POS_DY - 24}
        width={SUPPLY_W}
        height={(rows.length - 1) * ROW_H + (NEG_DY - POS_DY) + 48}
        rx="6"
        fill="none"
        stroke="currentColor"
        strokeWidth="2"
      />
      <text x={10 + SUPPLY_W / 2} y={TOP + POS_DY - 6} textAnchor="middle" fontSize="12" fontWeight="600" fill="currentColor">
        Supply
      </text>
      <text x={10 + SUPPLY_W / 2} y={TOP + POS_DY + 8} textAnchor="middle" fontSize="9" fill="currentColor">
        {clip(supplyName, 17)}
      </text>
      <text x={10 + SUPPLY_W / 2} y={TOP + NEG_DY + 8} textAnchor="middle" fontSize="10" fill="currentColor">
        {`${cv.nominalVoltageV} V`}
      </text>
      {rows.map(({ design: run, result }, i) => {
        const y0 = TOP + i * ROW_H;
        const pos = y0 + POS_DY;
        const neg = y0 + NEG_DY;
        const fitY = y0 + FIT_DY;
        const xs = result.fittings.map((_, k) => BUS_X + 40 + k * FIT_W + FIT_W / 2);
        const lastX = xs.at(-1)!;
        const feeder = run.layout === 'hub' ? run.feederLengthM : null;
        return (
          <g key={run.id}>
            <text x={BUS_X - 50} y={y0 + TITLE_DY} fontSize="11" fontWeight="600" fill="currentColor">
              {`Run: ${run.label || run.id} · ${LAYOUT_WORDS[run.layout]} · ${result.currentA.toFixed(2)} A`}
            </text>
            <text x={10 + SUPPLY_W - 6} y={pos + 4} textAnchor="end" fontSize="13" fontWeight="700" fill="currentColor">
              +
            </text>
            <text x={10 + SUPPLY_W - 6} y={neg + 4} textAnchor="end" fontSize="13" fontWeight="700" fill="currentColor">
              −
            </text>
            {/* the pair from the supply to the run's first segment (a hub's feeder to its junction) */}
            <line x1={10 + SUPPLY_W} y1={pos} x2={BUS_X} y2={pos} stroke="currentColor" strokeWidth="2.5" />
            <line x1={10 + SUPPLY_W} y1={neg} x2={BUS_X} y2={neg} stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
            <text x={(10 + SUPPLY_W + BUS_X) / 2} y={pos - 6} textAnchor="middle" fontSize="9" fill="currentColor">
              {feeder !== null ? `feeder ${metres(feeder)}` : run.layout === 'home-run' ? 'at the supply' : ''}
            </text>
            {feeder !== null ? (
              <g>
                <rect
                  x={BUS_X}
                  y={pos - 8}
                  width="14"
                  height={neg - pos + 16}
                  fill="none"
                  stroke="currentColor"
                  strokeWidth="1.5"
                />
                <text x={BUS_X + 7} y={neg + 20} textAnchor="middle" fontSize="8" fill="currentColor">
                  junction
                </text>
              </g>
            ) : null}
            {/* + and − along the run: a daisy chain's spans, or the hub's / supply's terminals */}
            <line x1={BUS_X} y1={pos} x2={lastX - 7} y2={pos} stroke="currentColor" strokeWidth="2.5" />
            <line x1={BUS_X} y1={neg} x2={lastX + 7} y2={neg} stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
            {result.fittings.map((f, k) => {
              const fx = xs[k]!;
              const placement = run.fittings[k];
              const label = placement?.label || `Fitting ${k + 1}`;
              const low = !f.withinDropLimit || !f.aboveOwnMinimum;
              const prevX = k === 0 ? BUS_X : xs[k - 1]!;
              const span = placement ? spanWords(run.layout, placement.spanLengthM) : '';
              return (
                <g key={f.fittingId + k}>
                  {run.layout === 'daisy-chain' ? (
                    <text x={(prevX + fx) / 2} y={pos - 6} textAnchor="middle" fontSize="9" fill="currentColor">
                      {span}
                    </text>
                  ) : null}
                  {/* + tail solid from the + conductor, − tail dashed from the − conductor */}
                  <line x1={fx - 7} y1={pos} x2={fx - 7} y2={fitY - 13} stroke="currentColor" strokeWidth="1.75" />
                  <line
                    x1={fx + 7}
                    y1={neg}
                    x2={fx + 7}
                    y2={fitY - 13}
                    stroke="currentColor"
                    strokeWidth="1.75"
                    strokeDasharray="4 3"
                  />
                  <circle cx={fx - 7} cy={pos} r="2.5" fill="currentColor" />
                  <circle cx={fx + 7} cy={neg} r="2.5" fill="currentColor" />
                  <text x={fx - 10} y={fitY - 18} textAnchor="end" fontSize="10" fontWeight="700" fill="currentColor">
                    +
                  </text>
                  <text x={fx + 10} y={fitY - 18} fontSize="10" fontWeight="700" fill="currentColor">
                    −
                  </text>
                  {run.layout !== 'daisy-chain' ? (
                    <text x={fx + 12} y={neg + 14} fontSize="8" fill="currentColor">
                      {span}
                    </text>
                  ) : null}
                  <circle
                    cx={fx}
                    cy={fitY}
                    r="13"
                    fill="none"
                    stroke="currentColor"
                    strokeWidth={low ? 3 : 2}
                    strokeDasharray={low ? '3 2' : undefined}
                  />
                  <text x={fx} y={fitY + 4} textAnchor="middle" fontSize="11" fontWeight="600" fill="currentColor">
                    {f.position}
                  </text>
                  <text x={fx} y={fitY + 26} textAnchor="middle" fontSize="9" fill="currentColor">
                    {clip(label, 16)}
                  </text>
                  <text x={fx} y={fitY + 38} textAnchor="middle" fontSize="10" fontWeight="600" fill="currentColor">
                    {`${f.voltageV.toFixed(2)} V`}
                  </text>
                  <text x={fx} y={fitY + 49} textAnchor="middle" fontSize="9" fill="currentColor">
                    {`${low ? '✕ ' : ''}drop ${f.dropPct.toFixed(1)} %`}
                  </text>
                </g>
              );
            })}
          </g>
        );
      })}
    </svg>
  );
}
