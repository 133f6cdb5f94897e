import { describeConductorEnd, parseConductorEnd, type BlockPlan } from '@gloaming/engine';

function endText(end: string, labels: readonly string[]): string {
  const parsed = parseConductorEnd(end);
  return parsed ? describeConductorEnd(parsed, labels) : end;
}

/** The terminal schedule: one table per connector block, then the installer's steps in order. */
export function TerminalSchedule({ plan }: { plan: BlockPlan }) {
  if (plan.blocks.length === 0) return null;
  return (
    <div className="grid gap-6 xl:grid-cols-2">
      {plan.blocks.map((block) => (
        <div key={block.number}>
          <table className="w-full text-caption" aria-label={`Terminal schedule, block ${block.number}`}>
            <caption className="mb-1.5 text-left text-body font-semibold text-ink">
              Block {block.number}: {block.blockType} ({block.ipCode}), fittings {block.fittings.join(', ')}
              <span className="ml-2 font-normal text-ink-muted">
                {block.spareTerminals} spare terminal{block.spareTerminals === 1 ? '' : 's'}, {block.entries.seals} seals,{' '}
                {block.entries.blankingPlugs} blanking plugs
              </span>
            </caption>
            <thead>
              <tr className="border-b border-line text-left text-ink-muted">
                <th scope="col" className="py-1 pr-3 font-semibold">
                  Terminal
                </th>
                <th scope="col" className="py-1 pr-3 font-semibold">
                  Conductor ends landed
                </th>
                <th scope="col" className="py-1 font-semibold">
                  Joint
                </th>
              </tr>
            </thead>
            <tbody>
              {block.terminals.map((t, i) => (
                <tr key={i} className="border-b border-line/60 align-top">
                  <td className="py-1 pr-3 font-mono">T{i + 1}</td>
                  <td className="py-1 pr-3">
                    <ul>
                      {t.conductors.map((c) => (
                        <li key={c}>
                          <span className="font-mono">{c}</span>{' '}
                          <span className="text-ink-muted">· {endText(c, plan.fittingLabels)}</span>
                        </li>
                      ))}
                    </ul>
                  </td>
                  <td className="py-1 text-ink-muted">{t.note ?? ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
      <div>
        <h4 className="mb-1.5 text-body font-semibold text-ink">Installer’s steps</h4>
        <ol className="list-decimal pl-5 text-caption" aria-label="Installer’s steps">
          {plan.steps.map((s, i) => (
            <li key={i} className="py-0.5">
              {s.text}
            </li>
          ))}
        </ol>
      </div>
    </div>
  );
}
