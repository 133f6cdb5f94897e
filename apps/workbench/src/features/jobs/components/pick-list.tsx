import { PICK_PLACE_LABELS, type JobPackResponse, type PickItem } from '@gloaming/contracts';

const qty = (i: PickItem) => (i.unit === 'each' ? String(i.quantity) : `${i.quantity} ${i.unit}`);
const metres = (m: number) => `${m.toLocaleString(undefined, { maximumFractionDigits: 2 })} m`;

function ItemTable({ items, label }: { items: readonly PickItem[]; label: string }) {
  return (
    <table className="w-full text-caption" aria-label={label}>
      <thead>
        <tr className="border-b border-line text-left text-ink-muted">
          <th scope="col" className="py-1 pr-2 font-semibold">
            Item
          </th>
          <th scope="col" className="py-1 pr-2 font-semibold">
            Code
          </th>
          <th scope="col" className="py-1 text-right font-semibold">
            Qty
          </th>
        </tr>
      </thead>
      <tbody>
        {items.map((i) => (
          <tr key={i.key} className="border-b border-line/60">
            <td className="py-1.5 pr-2 text-ink">{i.name}</td>
            <td className="py-1.5 pr-2 font-mono text-ink-muted">{i.code}</td>
            <td className="py-1.5 text-right tabular-nums">{qty(i)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** What to load: by where it is prepared (bench, van), then circuit by circuit. No prices. */
export function PickList({ pack }: { pack: JobPackResponse }) {
  return (
    <div className="flex flex-col gap-6">
      <div className="grid gap-6 lg:grid-cols-2">
        {pack.loads.map((g) => (
          <section key={g.place} aria-labelledby={`load-${g.place}`} className="flex flex-col gap-3">
            <h3 id={`load-${g.place}`} className="text-body font-semibold text-ink">
              {PICK_PLACE_LABELS[g.place]}
            </h3>
            {g.items.length > 0 && <ItemTable items={g.items} label={`${g.place} items`} />}
            {g.cuts.length > 0 && (
              <div className="overflow-x-auto">
                <table className="w-full min-w-[28rem] text-caption" aria-label="Cable cuts">
                  <caption className="mb-1 text-left text-ink-muted">
                    Cable cuts: each run plus slack, rounded up to 0.1 m
                  </caption>
                  <thead>
                    <tr className="border-b border-line text-left text-ink-muted">
                      <th scope="col" className="py-1 pr-2 font-semibold">
                        Run
                      </th>
                      <th scope="col" className="py-1 pr-2 font-semibold">
                        Cable
                      </th>
                      <th scope="col" className="py-1 pr-2 text-right font-semibold">
                        Run
                      </th>
                      <th scope="col" className="py-1 text-right font-semibold">
                        Cut
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {g.cuts.map((c, i) => (
                      <tr key={i} className="border-b border-line/60">
                        <td className="py-1.5 pr-2">
                          <span className="text-ink">{c.label}</span>
                          <span className="block text-micro text-ink-muted">{c.circuit}</span>
                        </td>
                        <td className="py-1.5 pr-2 text-ink-muted">{c.name}</td>
                        <td className="py-1.5 pr-2 text-right tabular-nums">{metres(c.runM)}</td>
                        <td className="py-1.5 text-right font-semibold tabular-nums">{metres(c.cutM)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
                <ul className="mt-2 text-caption text-ink" aria-label="Cable to take">
                  {g.cableTotals.map((t) => (
                    <li key={t.productId ?? t.name}>
                      Take {metres(t.totalM)} of {t.name}
                      {t.code ? ` (${t.code})` : ''}
                    </li>
                  ))}
                </ul>
              </div>
            )}
          </section>
        ))}
      </div>
      <section aria-labelledby="pick-by-circuit" className="flex flex-col gap-2">
        <h3 id="pick-by-circuit" className="text-body font-semibold text-ink">
          By circuit
        </h3>
        {pack.circuits.map((c) => (
          <details key={c.id} className="rounded-control ring-1 ring-line">
            <summary className="cursor-pointer px-3 py-2 text-body font-semibold text-ink">
              {c.name ? `${c.area}: ${c.name}` : c.area}
            </summary>
            <div className="px-3 pb-3">
              <ItemTable items={c.pick.items} label={`Pick list, ${c.area}`} />
              <ul className="mt-2 text-caption">
                {c.pick.cuts.map((k, i) => (
                  <li key={i}>
                    Cut {metres(k.cutM)} of {k.name}: {k.label}
                  </li>
                ))}
              </ul>
            </div>
          </details>
        ))}
      </section>
    </div>
  );
}
