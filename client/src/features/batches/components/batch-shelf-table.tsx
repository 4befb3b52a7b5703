import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { conversationPath } from '@shared/case-links';
import { STAGE_SUGAR_RULES } from '@shared/batch-check-model';
import { STATUS_LABELS } from '@shared/case-status';
import type { BatchCheckSummary, BatchView } from '@shared/case-schemas';
import { cx } from '../../../components/ui/cx';
import { RiskBadge } from '../../batch-check/components/risk-badge';
import { ratioText } from '../../batch-check/components/ratio-text';
import { ageText, formatMadeOn } from '../lib/batch-format';

interface ShelfRow {
  batch: BatchView;
  age: number;
  check: BatchCheckSummary | null;
}

const RISK_ORDER = { low: 0, medium: 1, high: 2 } as const;

const column = createColumnHelper<ShelfRow>();

const columns = [
  column.accessor((row) => row.batch.label, {
    id: 'label',
    header: 'Label',
    cell: (info) => (
      <>
        <Link to={`/batches/${info.row.original.batch.id}`} className="font-bold">
          {info.getValue()}
        </Link>
        <OpenCaseLine batch={info.row.original.batch} />
      </>
    ),
  }),
  column.accessor((row) => row.batch.stage, { id: 'stage', header: 'Stage' }),
  column.accessor((row) => row.batch.madeOn, {
    id: 'madeOn',
    header: 'Made on',
    cell: (info) => <span className="whitespace-nowrap">{formatMadeOn(info.getValue(), 'short')}</span>,
  }),
  column.accessor('age', {
    header: 'Age',
    cell: (info) => <span className="whitespace-nowrap tabular-nums">{ageText(info.getValue())}</span>,
  }),
  column.accessor((row) => (row.check ? RISK_ORDER[row.check.risk] : -1), {
    id: 'check',
    header: 'Sugar check',
    cell: (info) => <CheckCell check={info.row.original.check} batch={info.row.original.batch} />,
  }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: (info) => <RowActions batch={info.row.original.batch} />,
  }),
];

/** The batch's case still being worked on, so the grower goes back to it (to its conversation,
 * where new signs are told) rather than opening another. */
function OpenCaseLine({ batch }: { batch: BatchView }) {
  if (!batch.openCase) return null;
  return (
    <p className="mt-1 text-base">
      <span className="font-semibold text-clay-deep">{STATUS_LABELS[batch.openCase.status]}:</span>{' '}
      <Link to={conversationPath(batch.openCase.id)}>{batch.openCase.title}</Link>
    </p>
  );
}

function CheckCell({ check, batch }: { check: BatchCheckSummary | null; batch: BatchView }) {
  if (!check) return <span className="text-loam-soft">{missingWeights(batch)}</span>;
  return (
    <span className="flex flex-col items-start gap-1">
      <RiskBadge risk={check.risk} />
      <span className="text-sm whitespace-nowrap text-loam-soft">{ratioText(check.ratio)}</span>
    </span>
  );
}

function missingWeights(batch: BatchView): string {
  if (!batch.culture) return 'No weights recorded';
  // IMO1 is gathered without sugar; only once kept does it get its equal weight.
  if (batch.stage === 'IMO1') return 'Being gathered, no sugar yet';
  if (STAGE_SUGAR_RULES[batch.stage].targetRatio === null) return `No sugar rule for ${batch.stage}`;
  return 'No sugar weight recorded';
}

function RowActions({ batch }: { batch: BatchView }) {
  return (
    <span className="flex flex-wrap gap-x-3 gap-y-1">
      <Link to={`/cases/new?batch=${batch.id}`} className="inline-flex min-h-11 items-center font-bold whitespace-nowrap">
        {/* With a case still open (its line is above), a second one is a choice, not the way back. */}
        {batch.openCase ? 'Open another case' : 'Open a case'}
        <span className="sr-only"> about {batch.label}</span>
      </Link>
      <Link to={`/batches/${batch.id}/label`} className="inline-flex min-h-11 items-center whitespace-nowrap">
        Jar label<span className="sr-only"> for {batch.label}</span>
      </Link>
    </span>
  );
}

// What each direction means in words, for the phone's sort menu, the more useful one listed first
// (names A to Z, but the newest batches, the oldest and the riskiest first).
const SORT_CHOICES: Record<string, { name: string; asc: string; desc: string; first: 'asc' | 'desc' }> = {
  label: { name: 'Label', asc: 'A to Z', desc: 'Z to A', first: 'asc' },
  stage: { name: 'Stage', asc: 'A to Z', desc: 'Z to A', first: 'asc' },
  madeOn: { name: 'Date made', asc: 'oldest first', desc: 'newest first', first: 'desc' },
  age: { name: 'Age', asc: 'youngest first', desc: 'oldest first', first: 'desc' },
  check: { name: 'Sugar check', asc: 'lowest risk first', desc: 'highest risk first', first: 'desc' },
};

/** The grower's batches: a sortable table on wider screens, a list of cards on a phone. */
export function BatchShelfTable({ batches }: { batches: BatchView[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'madeOn', desc: true }]);
  const rows = useMemo<ShelfRow[]>(
    () => batches.map((batch) => ({ batch, age: batch.ageDays, check: batch.check })),
    [batches],
  );
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (row) => String(row.batch.id),
  });
  const sortedRows = table.getRowModel().rows;
  const sortable = table.getAllLeafColumns().filter((c) => c.getCanSort());
  const current = sorting[0];

  return (
    <div>
      {/* Phone: the same rows as cards, with a plain sort control. */}
      <div className="md:hidden">
        <div className="flex flex-wrap items-end gap-2">
          <label className="flex flex-col gap-1 font-bold">
            Sort by
            <select
              className="min-h-11 rounded-soft border-2 border-loam-soft bg-rice px-3"
              value={current ? `${current.id}:${current.desc ? 'desc' : 'asc'}` : ''}
              onChange={(event) => {
                const [id, dir] = event.target.value.split(':');
                setSorting([{ id, desc: dir === 'desc' }]);
              }}
            >
              {sortable.flatMap((c) =>
                (SORT_CHOICES[c.id].first === 'asc' ? (['asc', 'desc'] as const) : (['desc', 'asc'] as const)).map((dir) => (
                  <option key={`${c.id}:${dir}`} value={`${c.id}:${dir}`}>
                    {SORT_CHOICES[c.id].name}, {SORT_CHOICES[c.id][dir]}
                  </option>
                )),
              )}
            </select>
          </label>
        </div>
        <ul className="mt-4 flex flex-col gap-3" aria-label="Your batches">
          {sortedRows.map(({ original: { batch, age, check } }) => (
            <li key={batch.id} className="rounded-soft border border-line bg-rice-deep p-4">
              <p className="text-lg">
                <Link to={`/batches/${batch.id}`} className="font-extrabold">
                  {batch.label}
                </Link>
              </p>
              <p className="text-loam-soft">
                {batch.stage} · {age === 0 ? 'made today' : `made ${formatMadeOn(batch.madeOn, 'short')} · ${ageText(age)} old`}
              </p>
              <OpenCaseLine batch={batch} />
              <div className="mt-2">
                <CheckCell check={check} batch={batch} />
              </div>
              <div className="mt-1">
                <RowActions batch={batch} />
              </div>
            </li>
          ))}
        </ul>
      </div>

      {/* Wider screens: the sortable table. */}
      <div className="hidden overflow-x-auto rounded-soft border border-line md:block">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Your batches. Choose a column heading to sort.</caption>
          <thead className="bg-rice-deep">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                      className="border-b-2 border-line px-3 py-2 align-bottom"
                    >
                      {header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex min-h-11 items-center gap-1 rounded-soft font-extrabold hover:underline"
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <SortMark direction={sorted} />
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {sortedRows.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-b-0 even:bg-rice-deep/40">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={cx('px-3 py-2 align-top', cell.column.id === 'label' && 'max-w-64')}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function SortMark({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 12 16" className={cx('h-4 w-3', direction ? 'text-loam' : 'text-loam-soft/60')}>
      <path d="M6 1 L11 6 H1 Z" fill="currentColor" opacity={direction === 'desc' ? 0.25 : 1} />
      <path d="M6 15 L11 10 H1 Z" fill="currentColor" opacity={direction === 'asc' ? 0.25 : 1} />
    </svg>
  );
}
