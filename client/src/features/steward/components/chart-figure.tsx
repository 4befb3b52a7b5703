import { useId, type ReactNode } from 'react';

/**
 * A chart with its text equivalent: a heading, a summary sentence that says what the chart
 * shows, the picture (hidden from screen readers, which get the summary and the table), and
 * the numbers as a table for anyone who wants them exactly.
 */
export function ChartFigure({ title, summary, chart, table, height = 288 }: { title: string; summary: ReactNode; chart: ReactNode | null; table: ReactNode; height?: number }) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="rounded-soft border border-line bg-rice p-4 sm:p-5">
      <h3 id={headingId} className="text-lg font-extrabold">
        {title}
      </h3>
      <div className="mt-1 text-loam-soft">{summary}</div>
      {chart && (
        <div aria-hidden="true" className="mt-4 w-full" style={{ height }}>
          {chart}
        </div>
      )}
      <details className="mt-3">
        <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold text-moss-deep underline underline-offset-4">The numbers as a table</summary>
        <div className="mt-2 overflow-x-auto">{table}</div>
      </details>
    </section>
  );
}

export function NumbersTable({ caption, head, rows }: { caption: string; head: string[]; rows: Array<Array<string | number>> }) {
  return (
    <table className="w-full min-w-max border-collapse text-left text-base">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr>
          {head.map((h) => (
            <th key={h} scope="col" className="border-b-2 border-line px-2 py-1 font-extrabold">
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((row, i) => (
          <tr key={i} className="odd:bg-rice-deep">
            {row.map((cell, j) =>
              j === 0 ? (
                <th key={j} scope="row" className="px-2 py-1 font-bold">
                  {cell}
                </th>
              ) : (
                <td key={j} className="px-2 py-1 tabular-nums">
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
