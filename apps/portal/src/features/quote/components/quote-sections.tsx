import type { PortalLine, PortalQuoteView, PortalSection, PortalSelection } from '@gloaming/contracts';
import type { Formatters } from '../../../components/ui/format';

interface Props {
  quote: PortalQuoteView;
  selection: PortalSelection;
  /** Null once the quote is decided: the choice is then shown, not offered. */
  onChoose: ((lineId: string, chosen: boolean) => void) | null;
  f: Formatters;
}

/** Each area of the garden: what is included, optional extras to tick, and pick-one choices. */
export function QuoteSections({ quote, selection, onChoose, f }: Props) {
  return (
    <div className="flex flex-col gap-4">
      {quote.sections.map((section) => (
        <SectionCard key={section.id} section={section} selection={selection} onChoose={onChoose} f={f} />
      ))}
    </div>
  );
}

function SectionCard({ section, selection, onChoose, f }: { section: PortalSection } & Omit<Props, 'quote'>) {
  const fixed = section.lines.filter((l) => l.kind === 'standard');
  const optional = section.lines.filter((l) => l.kind === 'optional');
  const groups = [...new Set(section.lines.filter((l) => l.kind === 'alternative').map((l) => l.group ?? ''))];
  const headingId = `section-${section.id}`;
  return (
    <section aria-labelledby={headingId} className="rounded-card bg-surface p-4 shadow-card ring-1 ring-line sm:p-6">
      <h3 id={headingId} className="text-lead font-semibold">
        {section.name}
      </h3>
      {fixed.length > 0 && (
        <ul className="mt-3 divide-y divide-line">
          {fixed.map((line) => (
            <li key={line.id} className="py-3">
              <LineText line={line} f={f} />
            </li>
          ))}
        </ul>
      )}
      {optional.length > 0 && (
        <fieldset className="mt-4">
          <legend className="font-semibold text-lamp-800">Optional extras</legend>
          <ul className="mt-2 flex flex-col gap-2">
            {optional.map((line) => {
              const chosen = selection[line.id] ?? line.selected;
              return (
                <li key={line.id}>
                  {onChoose ? (
                    <label className="flex cursor-pointer gap-3 rounded-control p-3 ring-1 ring-line has-[:checked]:bg-lamp-50 has-[:checked]:ring-lamp-400">
                      <input
                        type="checkbox"
                        className="mt-1 size-5 shrink-0 accent-dusk-600"
                        checked={chosen}
                        onChange={(e) => onChoose(line.id, e.target.checked)}
                      />
                      <LineText line={line} f={f} />
                    </label>
                  ) : (
                    <div className="rounded-control p-3 ring-1 ring-line">
                      <LineText line={line} f={f} />
                      <p className="mt-1 text-caption font-semibold">{chosen ? 'Included' : 'Not included'}</p>
                    </div>
                  )}
                </li>
              );
            })}
          </ul>
        </fieldset>
      )}
      {groups.map((group) => {
        const lines = section.lines.filter((l) => l.kind === 'alternative' && (l.group ?? '') === group);
        return (
          <fieldset key={group} className="mt-4">
            <legend className="font-semibold text-lamp-800">Choose one: {group}</legend>
            <ul className="mt-2 flex flex-col gap-2">
              {lines.map((line) => {
                const chosen = selection[line.id] ?? line.selected;
                return (
                  <li key={line.id}>
                    {onChoose ? (
                      <label className="flex cursor-pointer gap-3 rounded-control p-3 ring-1 ring-line has-[:checked]:bg-lamp-50 has-[:checked]:ring-lamp-400">
                        <input
                          type="radio"
                          name={`group-${section.id}-${group}`}
                          className="mt-1 size-5 shrink-0 accent-dusk-600"
                          checked={chosen}
                          onChange={() => onChoose(line.id, true)}
                        />
                        <LineText line={line} f={f} />
                      </label>
                    ) : (
                      <div className="rounded-control p-3 ring-1 ring-line">
                        <LineText line={line} f={f} />
                        <p className="mt-1 text-caption font-semibold">{chosen ? 'Chosen' : 'Not chosen'}</p>
                      </div>
                    )}
                  </li>
                );
              })}
            </ul>
          </fieldset>
        );
      })}
    </section>
  );
}

function LineText({ line, f }: { line: PortalLine; f: Formatters }) {
  const discount =
    line.discount === null
      ? ''
      : line.discount.kind === 'percent'
        ? `, less ${f.rate(line.discount.bp)}`
        : `, less ${f.money(line.discount.amountMinor)}`;
  return (
    <span className="flex min-w-0 flex-1 flex-col gap-0.5">
      <span className="flex flex-wrap items-baseline justify-between gap-x-3">
        <span className="min-w-0 break-words text-ink">{line.description}</span>
        <span className="font-semibold whitespace-nowrap tabular-nums">{f.money(line.amountMinor)}</span>
      </span>
      <span className="text-caption text-ink-muted">
        {f.quantity(line.quantityMilli, line.unit)} at {f.money(line.unitPriceMinor)}
        {discount}, VAT {f.rate(line.vatRateBp)}
      </span>
      {line.note && <span className="text-caption text-ink-muted">{line.note}</span>}
    </span>
  );
}
