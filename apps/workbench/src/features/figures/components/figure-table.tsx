import { Button } from '../../../components/ui/button';
import { downloadText, toCsv, type CsvCell } from '../../../lib/csv';

/** One column of a figures table: how a row shows it, and the plain value its CSV holds. */
export interface FigureColumn<R> {
  label: string;
  show: (row: R) => string;
  csv: (row: R) => CsvCell;
  numeric?: boolean;
}

/** The table behind a chart, with a CSV download of exactly these rows and columns. */
export function FigureTable<R>({
  caption,
  columns,
  rows,
  fileName,
}: {
  caption: string;
  columns: readonly FigureColumn<R>[];
  rows: readonly R[];
  fileName: string;
}) {
  function download() {
    downloadText(
      fileName,
      toCsv(
        columns.map((c) => c.label),
        rows.map((r) => columns.map((c) => c.csv(r))),
      ),
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto">
        <table className="w-full text-left text-body" data-figure-table={fileName}>
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr className="border-b border-line text-caption text-ink-muted">
              {columns.map((c) => (
                <th key={c.label} scope="col" className={`pb-2 pr-4 font-semibold ${c.numeric ? 'text-right' : ''}`}>
                  {c.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="py-3 text-ink-muted">
                  Nothing in this period.
                </td>
              </tr>
            ) : (
              rows.map((r, i) => (
                <tr key={i} className="border-b border-line last:border-0">
                  {columns.map((c) => (
                    <td key={c.label} className={`py-2 pr-4 ${c.numeric ? 'text-right font-mono tabular-nums' : ''}`}>
                      {c.show(r)}
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
      <Button variant="secondary" className="self-start" onClick={download} aria-label={`Download ${caption} as CSV`}>
        Download CSV
      </Button>
    </div>
  );
}
