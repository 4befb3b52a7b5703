// The rounds as a table on wide screens and as cards on a phone. Both are drawn from the same
// table model and the same cell definitions, so a column reads the same in either layout.
import { createContext, useContext, useMemo } from 'react';
import { Link } from 'react-router';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type Row } from '@tanstack/react-table';
import type { CaseListItem } from '@shared/case-schemas';
import { conversationPath } from '@shared/case-links';
import { OPEN_STATUSES, STATUS_LABELS } from '@shared/case-status';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { useClaimCase } from '../../threads/api/claim-case';
import { useUnread } from '../../threads/api/get-unread';
import { hoursWords, timeAgo } from '../../threads/lib/time-words';
import { bySeriousness, symptomShort } from '../lib/symptom-words';
import type { RoundsSort } from '../lib/rounds-filters';
import { UrgencyBadge } from './urgency-badge';

const SHOWN_SYMPTOMS = 3;
const column = createColumnHelper<CaseListItem>();

function Symptoms({ symptoms }: { symptoms: CaseListItem['symptoms'] }) {
  if (symptoms.length === 0) return <span className="text-loam-soft">None given</span>;
  const ordered = bySeriousness(symptoms);
  const rest = ordered.length - SHOWN_SYMPTOMS;
  return (
    <ul className="flex flex-wrap gap-1" aria-label="Symptoms">
      {ordered.slice(0, SHOWN_SYMPTOMS).map((s) => (
        <li key={s} className="whitespace-nowrap rounded-full border border-line bg-rice px-2 text-sm">
          {symptomShort(s)}
        </li>
      ))}
      {rest > 0 && (
        <li className="px-1 text-sm text-loam-soft" title={ordered.slice(SHOWN_SYMPTOMS).map(symptomShort).join(', ')}>
          +{rest} more
        </li>
      )}
    </ul>
  );
}

// The claim in flight reaches the buttons through context, not through the column definitions:
// new definitions are new cell components, and React would remount every cell (and drop the
// focus inside one) each time a claim starts or ends.
const ClaimState = createContext<{ claimingId: number | null; onClaim: (id: number) => void }>({ claimingId: null, onClaim: () => {} });

function ClaimButton({ item }: { item: CaseListItem }) {
  const { claimingId, onClaim } = useContext(ClaimState);
  if (item.mentor || !OPEN_STATUSES.includes(item.status)) return null;
  const busy = claimingId === item.id;
  return (
    <Button variant="secondary" className="px-3!" disabled={claimingId !== null} onClick={() => onClaim(item.id)} data-claim-button>
      {busy ? 'Claiming…' : 'Claim'}
      <span className="sr-only"> “{item.title}”</span>
    </Button>
  );
}

/**
 * On a case the mentor holds, what the grower wrote since the mentor last read it: a link of its
 * own, straight to the conversation (the case's own link still opens the case at its top). The
 * counts are the header badge's.
 */
function NewMessages({ caseId }: { caseId: number }) {
  const fresh = useUnread(true).data?.byCase[String(caseId)] ?? 0;
  if (fresh === 0) return null;
  return (
    <Link to={conversationPath(caseId)} className="mt-1 inline-block rounded-full bg-moss px-2 text-sm font-extrabold text-rice no-underline">
      {fresh} new<span className="sr-only"> {fresh === 1 ? 'message' : 'messages'} in this conversation</span>
    </Link>
  );
}

/**
 * A claimed case's button goes away (and is disabled while the claim is under way), which would
 * drop keyboard focus to the start of the page; it goes to the case just taken instead, unless
 * the person has already moved on to something else.
 */
function focusClaimedCase(caseId: number): void {
  const active = document.activeElement;
  if (active && active !== document.body && !active.hasAttribute('data-claim-button')) return;
  // Both layouts are in the page; only one is shown.
  const links = document.querySelectorAll<HTMLElement>(`[data-rounds-case="${caseId}"]`);
  [...links].find((link) => link.offsetParent !== null)?.focus();
}

export function RoundsTable({ items, sort, myUserId }: { items: CaseListItem[]; sort: RoundsSort; myUserId: number }) {
  const claim = useClaimCase();
  const claimingId = claim.isPending ? (claim.variables ?? null) : null;
  const { mutate: claimCase } = claim;
  const claimState = useMemo(
    () => ({ claimingId, onClaim: (id: number) => claimCase(id, { onSuccess: () => focusClaimedCase(id) }) }),
    [claimingId, claimCase],
  );

  const columns = useMemo(
    () => [
      column.accessor('urgency', {
        header: 'Urgency',
        cell: ({ row }) => <UrgencyBadge caseId={row.original.id} score={row.original.urgency} level={row.original.urgencyLevel} />,
      }),
      column.accessor('title', {
        header: 'Case',
        cell: ({ row }) => (
          <div className="min-w-0">
            <Link to={`/cases/${row.original.id}`} className="font-extrabold" data-rounds-case={row.original.id}>
              {row.original.title}
            </Link>
            <p className="text-sm text-loam-soft">
              {row.original.grower.displayName} · opened {timeAgo(row.original.openedAt)}
            </p>
            <NewMessages caseId={row.original.id} />
          </div>
        ),
      }),
      column.accessor('stage', { header: 'Stage', cell: (info) => <span className="font-bold">{info.getValue()}</span> }),
      column.accessor('symptoms', { header: 'Symptoms', cell: (info) => <Symptoms symptoms={info.getValue()} /> }),
      column.accessor('waitingHours', {
        header: 'Waiting for',
        cell: (info) => {
          const hours = info.getValue();
          return hours === null ? <span className="text-loam-soft">Not waiting</span> : <span className="whitespace-nowrap font-bold">{hoursWords(hours)}</span>;
        },
      }),
      column.accessor('status', { header: 'Status', cell: (info) => STATUS_LABELS[info.getValue()] }),
      column.accessor('mentor', {
        header: 'Mentor',
        cell: (info) => {
          const mentor = info.getValue();
          if (!mentor) return <span className="text-loam-soft">Nobody yet</span>;
          return mentor.id === myUserId ? <span className="font-bold">You</span> : mentor.displayName;
        },
      }),
      column.accessor('lastMessagePreview', {
        header: 'Last message',
        cell: ({ row }) =>
          row.original.lastMessageAt ? (
            <div className="min-w-0">
              <p className="line-clamp-2 break-words text-base">{row.original.lastMessagePreview}</p>
              <p className="text-sm text-loam-soft">{timeAgo(row.original.lastMessageAt)}</p>
            </div>
          ) : (
            <span className="text-loam-soft">No messages yet</span>
          ),
      }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => <ClaimButton item={row.original} />,
      }),
    ],
    [myUserId],
  );

  const table = useReactTable({
    data: items,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (item) => String(item.id),
    // The server sorts and pages: a page of 25 cannot be re-sorted alone.
    manualSorting: true,
    manualPagination: true,
  });

  const cell = (row: Row<CaseListItem>, id: string) => {
    const found = row.getVisibleCells().find((c) => c.column.id === id);
    return found ? flexRender(found.column.columnDef.cell, found.getContext()) : null;
  };

  return (
    <ClaimState value={claimState}>
      {claim.error && (
        <p role="alert" className="mb-3 rounded-soft border-l-8 border-ember bg-ember-mist px-4 py-3 font-semibold text-ember">
          Could not claim that case: {claim.error.message}
        </p>
      )}

      {/* Wide screens: the table. */}
      <div className="hidden overflow-x-auto rounded-soft border border-line lg:block">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Cases on the rounds, {sort === 'urgency' ? 'most urgent first' : sort === 'oldest' ? 'oldest first' : 'newest first'}</caption>
          <thead className="bg-rice-deep">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={header.column.id === 'urgency' && sort === 'urgency' ? 'descending' : undefined}
                    className="border-b border-line px-2 py-2 text-sm font-extrabold text-loam-soft first:pl-3"
                  >
                    {flexRender(header.column.columnDef.header, header.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-line align-top last:border-b-0 hover:bg-rice-deep/60">
                {row.getVisibleCells().map((c) => (
                  <td
                    key={c.id}
                    className={cx(
                      'px-2 py-3 first:pl-3 last:pr-3',
                      c.column.id === 'title' && 'min-w-48',
                      c.column.id === 'symptoms' && 'min-w-36 max-w-48',
                      c.column.id === 'lastMessagePreview' && 'min-w-36 max-w-52',
                      (c.column.id === 'status' || c.column.id === 'mentor' || c.column.id === 'waitingHours') && 'text-base',
                    )}
                  >
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {/* Phones and narrow windows: one card per case. */}
      <ul className="flex flex-col gap-3 lg:hidden" aria-label="Cases on the rounds">
        {table.getRowModel().rows.map((row) => (
          <li key={row.id} className="rounded-soft border border-line bg-rice-deep p-4">
            <div className="flex items-start justify-between gap-3">
              {cell(row, 'urgency')}
              <span className="rounded-full border border-loam-soft px-2 text-sm font-bold">{STATUS_LABELS[row.original.status]}</span>
            </div>
            <div className="mt-2">{cell(row, 'title')}</div>
            <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-base">
              <dt className="text-loam-soft">Stage</dt>
              <dd>{cell(row, 'stage')}</dd>
              <dt className="text-loam-soft">Waiting for</dt>
              <dd>{cell(row, 'waitingHours')}</dd>
              <dt className="text-loam-soft">Mentor</dt>
              <dd>{cell(row, 'mentor')}</dd>
            </dl>
            <div className="mt-2">{cell(row, 'symptoms')}</div>
            <div className="mt-3 border-t border-line pt-2">{cell(row, 'lastMessagePreview')}</div>
            <div className="mt-3 flex flex-wrap gap-2 empty:hidden">{cell(row, 'actions')}</div>
          </li>
        ))}
      </ul>
    </ClaimState>
  );
}
