import { useId, useState, type ReactNode } from 'react';
import { Button } from '../../../components/ui/button.tsx';

export interface ChartFigureProps {
  title: string;
  /** One or two sentences saying what the chart shows, read out in place of the picture. */
  summary: string;
  /** A line under the title, e.g. which months the chart covers. */
  note?: string;
  chart: ReactNode;
  /** The same data as a table: the chart's text alternative. */
  table: ReactNode;
}

/**
 * A chart with its text alternative: a caption, a spoken summary, and a "Show as table"
 * switch that swaps the picture for the numbers. Kept whole on one printed page.
 */
export function ChartFigure({ title, summary, note, chart, table }: ChartFigureProps) {
  const [asTable, setAsTable] = useState(false);
  const id = useId();
  return (
    <figure aria-labelledby={`${id}-caption`} className="min-w-0 break-inside-avoid space-y-3 rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt sm:p-6">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <figcaption id={`${id}-caption`} className="space-y-1">
          <span className="block text-xl font-bold">{title}</span>
          {note ? <span className="block text-thread-soft">{note}</span> : null}
        </figcaption>
        <Button variant="secondary" aria-pressed={asTable} aria-controls={`${id}-body`} onClick={() => setAsTable((v) => !v)} className="print:hidden">
          {asTable ? 'Show as chart' : 'Show as table'}
        </Button>
      </div>
      <div id={`${id}-body`}>
        {asTable ? (
          // Scrolls sideways on a phone; focusable so the keyboard can scroll it too.
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`${title}, as a table`}>
            {table}
          </div>
        ) : (
          <div role="img" aria-label={`${title}. ${summary}`}>
            {chart}
          </div>
        )}
      </div>
    </figure>
  );
}

/** A plain data table for a chart's numbers: first column names the row. */
export function ChartTable({ caption, columns, rows }: { caption: string; columns: string[]; rows: Array<{ key: string; cells: ReactNode[] }> }) {
  return (
    <table className="w-full border-collapse text-left">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="border-b-2 border-thread">
          {columns.map((column, index) => (
            <th key={column} scope="col" className={index === 0 ? 'py-2 pr-4 font-bold' : 'py-2 pr-4 text-right font-bold'}>
              {column}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.key} className="border-b border-seam">
            {row.cells.map((cell, index) =>
              index === 0 ? (
                <th key={index} scope="row" className="whitespace-nowrap py-2 pr-4 text-left font-semibold">
                  {cell}
                </th>
              ) : (
                <td key={index} className="whitespace-nowrap py-2 pr-4 text-right tabular-nums">
                  {cell}
                </td>
              ),
            )}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
