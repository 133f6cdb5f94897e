import type { BlockPlan } from '@gloaming/engine';

const FIT_W = 56;
const BLOCK_GAP = 70;
const TOP = 46;
const FWD_Y = 70;
const RET_Y = 104;
const BLOCK_H = 70;
const FIT_Y = 190;

/**
 * The string drawn from its terminal schedule: the driver, each connector block with its
 * fittings, the + conductor carrying the string on (solid, marked +) and the return leg back
 * to the driver's − (dashed, marked −), and the link cables between blocks. Polarity is in
 * the marks, labels and line style, never in colour alone.
 */
export function StringDiagram({ plan, driverName }: { plan: BlockPlan; driverName: string }) {
  if (plan.blocks.length === 0) return null;
  const widths = plan.blocks.map((b) => Math.max(120, b.fittings.length * FIT_W + 20));
  const xs: number[] = [];
  let x = 150;
  for (const w of widths) {
    xs.push(x);
    x += w + BLOCK_GAP;
  }
  const width = x - BLOCK_GAP + 20;
  const height = FIT_Y + 70;
  const lastX = xs.at(-1)! + widths.at(-1)!;
  return (
    <svg
      role="img"
      aria-labelledby="string-diagram-title"
      viewBox={`0 0 ${width} ${height}`}
      width={width}
      height={height}
      className="max-w-none text-ink"
    >
      <title id="string-diagram-title">
        {`Wiring diagram: ${driverName} feeds ${plan.fittingLabels.length} fittings in series over ${plan.blocks.length} connector block${plan.blocks.length === 1 ? '' : 's'}; the return leg runs back to the driver's negative.`}
      </title>
      {/* legend */}
      <g fontSize="11" fill="currentColor">
        <line x1="10" y1="14" x2="40" y2="14" stroke="currentColor" strokeWidth="2.5" />
        <text x="46" y="18">
          + string (forward)
        </text>
        <line x1="170" y1="14" x2="200" y2="14" stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
        <text x="206" y="18">
          − return leg
        </text>
      </g>
      {/* driver */}
      <rect x="10" y={TOP} width="100" height={BLOCK_H} rx="6" fill="none" stroke="currentColor" strokeWidth="2" />
      <text x="60" y={TOP + 22} textAnchor="middle" fontSize="12" fontWeight="600" fill="currentColor">
        Driver
      </text>
      <text x="60" y={TOP + 38} textAnchor="middle" fontSize="9" fill="currentColor">
        {driverName.length > 18 ? `${driverName.slice(0, 17)}…` : driverName}
      </text>
      <text x="100" y={FWD_Y + 4} textAnchor="end" fontSize="13" fontWeight="700" fill="currentColor">
        +
      </text>
      <text x="100" y={RET_Y + 4} textAnchor="end" fontSize="13" fontWeight="700" fill="currentColor">
        −
      </text>
      {/* driver lead: + forward, − return */}
      <line x1="110" y1={FWD_Y} x2={xs[0]} y2={FWD_Y} stroke="currentColor" strokeWidth="2.5" />
      <line x1="110" y1={RET_Y} x2={xs[0]} y2={RET_Y} stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
      <text x={(110 + xs[0]!) / 2} y={FWD_Y - 6} textAnchor="middle" fontSize="9" fill="currentColor">
        lead
      </text>
      {plan.blocks.map((block, j) => {
        const bx = xs[j]!;
        const bw = widths[j]!;
        const link = plan.links[j];
        const nextX = xs[j + 1];
        return (
          <g key={block.number}>
            <rect x={bx} y={TOP} width={bw} height={BLOCK_H} rx="4" fill="none" stroke="currentColor" strokeWidth="2" />
            <text x={bx + 6} y={TOP + 14} fontSize="11" fontWeight="600" fill="currentColor">
              Block {block.number}
            </text>
            {/* the return leg passes through every block */}
            <line
              x1={bx}
              y1={RET_Y}
              x2={bx + bw}
              y2={RET_Y}
              stroke="currentColor"
              strokeWidth="2"
              strokeDasharray="6 4"
              opacity="0.8"
            />
            {block.fittings.map((n, k) => {
              const fx = bx + 20 + k * FIT_W + FIT_W / 2 - 10;
              const label = plan.fittingLabels[n - 1] ?? '';
              return (
                <g key={n}>
                  {/* + tail solid, − tail dashed */}
                  <line x1={fx - 7} y1={TOP + BLOCK_H} x2={fx - 7} y2={FIT_Y - 13} stroke="currentColor" strokeWidth="1.75" />
                  <line
                    x1={fx + 7}
                    y1={TOP + BLOCK_H}
                    x2={fx + 7}
                    y2={FIT_Y - 13}
                    stroke="currentColor"
                    strokeWidth="1.75"
                    strokeDasharray="4 3"
                  />
                  <text x={fx - 10} y={FIT_Y - 18} textAnchor="end" fontSize="10" fontWeight="700" fill="currentColor">
                    +
                  </text>
                  <text x={fx + 10} y={FIT_Y - 18} fontSize="10" fontWeight="700" fill="currentColor">
                    −
                  </text>
                  <circle cx={fx} cy={FIT_Y} r="13" fill="none" stroke="currentColor" strokeWidth="2" />
                  <text x={fx} y={FIT_Y + 4} textAnchor="middle" fontSize="11" fontWeight="600" fill="currentColor">
                    {n}
                  </text>
                  <text x={fx} y={FIT_Y + 28} textAnchor="middle" fontSize="9" fill="currentColor">
                    {label.length > 10 ? `${label.slice(0, 9)}…` : label}
                  </text>
                </g>
              );
            })}
            {link && nextX !== undefined ? (
              <g>
                <line x1={bx + bw} y1={FWD_Y} x2={nextX} y2={FWD_Y} stroke="currentColor" strokeWidth="2.5" />
                <line x1={bx + bw} y1={RET_Y} x2={nextX} y2={RET_Y} stroke="currentColor" strokeWidth="2" strokeDasharray="6 4" />
                <text x={(bx + bw + nextX) / 2} y={FWD_Y - 6} textAnchor="middle" fontSize="9" fill="currentColor">
                  {`link ${link.number}${link.lengthM !== null ? ` · ${link.lengthM} m` : ''}`}
                </text>
                <text x={(bx + bw + nextX) / 2} y={FWD_Y + 13} textAnchor="middle" fontSize="8" fill="currentColor">
                  core 1 +
                </text>
                <text x={(bx + bw + nextX) / 2} y={RET_Y + 13} textAnchor="middle" fontSize="8" fill="currentColor">
                  core 2 −
                </text>
              </g>
            ) : null}
          </g>
        );
      })}
      <text x={lastX} y={height - 6} textAnchor="end" fontSize="9" fill="currentColor">
        The last fitting’s − returns along the dashed leg to the driver’s −
      </text>
    </svg>
  );
}
