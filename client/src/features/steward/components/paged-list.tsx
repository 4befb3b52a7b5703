import { useState, type ReactNode } from 'react';
import type { UseQueryResult } from '@tanstack/react-query';
import type { Paged } from '@shared/steward-schemas';
import { Alert } from '../../../components/ui/alert';
import { cx } from '../../../components/ui/cx';
import { Spinner } from '../../../components/ui/spinner';
import { SelectField } from './form-controls';
import { Pager } from './pager';

/** One page of a steward list with its loading, failure and empty states, and the pager. */
export function PagedList<T extends { id: number }>({
  query,
  loadingLabel,
  errorTitle,
  empty,
  page,
  onPage,
  pagerLabel,
  ordered = false,
  className = 'flex flex-col gap-4',
  itemClassName,
  renderItem,
  above,
}: {
  query: UseQueryResult<Paged<T>>;
  loadingLabel: string;
  errorTitle: string;
  empty: ReactNode;
  page: number;
  onPage: (page: number) => void;
  pagerLabel: string;
  ordered?: boolean;
  className?: string;
  itemClassName?: string;
  renderItem: (item: T) => ReactNode;
  /** shown above a non-empty list, e.g. how many there are */
  above?: (data: Paged<T>) => ReactNode;
}) {
  if (query.isPending) return <Spinner label={loadingLabel} />;
  if (query.isError) {
    return (
      <Alert tone="danger" title={errorTitle}>
        {query.error.message}
      </Alert>
    );
  }
  const { data } = query;
  if (data.items.length === 0) return <p className="text-loam-soft">{empty}</p>;
  const List = ordered ? 'ol' : 'ul';
  return (
    <>
      {above?.(data)}
      <List className={cx(className, query.isPlaceholderData && 'opacity-60')}>
        {data.items.map((item) => (
          <li key={item.id} className={itemClassName}>
            {renderItem(item)}
          </li>
        ))}
      </List>
      <Pager page={page} pageSize={data.pageSize} total={data.total} onPage={onPage} label={pagerLabel} />
    </>
  );
}

/** Where a finished action is announced, politely, above the list it changed. */
export function DoneNotice({ message }: { message: string | null }) {
  return (
    <div aria-live="polite" className="mt-5">
      {message && (
        <Alert tone="success" className="mb-4">
          {message}
        </Alert>
      )}
    </div>
  );
}

/** A list's status filter, page and last announcement; choosing a status starts at page 1. */
export function useStatusPages<S extends string>(initial: S) {
  const [status, setStatusState] = useState<S>(initial);
  const [page, setPage] = useState(1);
  const [done, setDone] = useState<string | null>(null);
  const setStatus = (next: S) => {
    setStatusState(next);
    setPage(1);
    setDone(null);
  };
  return { status, setStatus, page, setPage, done, setDone };
}

export function StatusSelect<S extends string>({ value, options, onChange }: { value: S; options: ReadonlyArray<{ value: S; label: string }>; onChange: (value: S) => void }) {
  return (
    <SelectField label="Show" className="w-full sm:w-72" value={value} onChange={(e) => onChange(e.target.value as S)}>
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </SelectField>
  );
}
