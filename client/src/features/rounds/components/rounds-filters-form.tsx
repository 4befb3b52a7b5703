import { useId, useState, type ReactNode } from 'react';
import { CASE_STATUSES, STATUS_LABELS } from '@shared/case-status';
import { STAGES, SYMPTOM_GROUPS, SYMPTOMS } from '@shared/vocabulary';
import { Button, buttonClasses } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { useAddressFilters } from '../../../lib/use-address-filters';
import { AGE_BANDS, DEFAULT_FILTERS, type RoundsFilters, type RoundsSort } from '../lib/rounds-filters';

const SORT_WORDS: Record<RoundsSort, string> = {
  urgency: 'Most urgent first',
  oldest: 'Waiting longest first',
  newest: 'Newest first',
};

const selectClass = 'min-h-11 w-full rounded-soft border-2 border-loam-soft bg-rice px-3 text-base text-loam';

function Field({ label, children, id }: { label: string; children: ReactNode; id: string }) {
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-base font-bold">
        {label}
      </label>
      {children}
    </div>
  );
}

/** Every change applies at once and lands in the address bar (see rounds-filters.ts). */
export function RoundsFiltersForm({ filters: address, onChange }: { filters: RoundsFilters; onChange: (next: RoundsFilters) => void }) {
  const [filters, choose] = useAddressFilters(address, onChange);
  const id = useId();
  // On a phone the five controls would push the cases below the fold; they fold away there.
  const [shown, setShown] = useState(false);
  // Any filter change starts again at page 1: page 3 of a narrower list may not exist.
  const set = (change: Partial<RoundsFilters>) => choose({ ...change, page: 1 });
  const active = [filters.status !== DEFAULT_FILTERS.status, filters.stage, filters.symptom, filters.age, filters.mine].filter(Boolean).length;
  const changed = active > 0 || filters.sort !== DEFAULT_FILTERS.sort;

  return (
    <div>
      <button
        type="button"
        aria-expanded={shown}
        aria-controls={`${id}-form`}
        onClick={() => setShown((v) => !v)}
        className={cx(buttonClasses('secondary'), 'w-full justify-between! lg:hidden')}
      >
        <span>{shown ? 'Hide filters' : 'Filters and order'}</span>
        <span className="text-sm font-semibold">{active === 0 ? 'all open cases' : active === 1 ? '1 filter on' : `${active} filters on`}</span>
      </button>
      <form
        id={`${id}-form`}
        aria-label="Filter the rounds"
        onSubmit={(event) => event.preventDefault()}
        className={cx(
          shown ? 'mt-3 grid' : 'hidden',
          'grid-cols-1 gap-3 rounded-soft border border-line bg-rice-deep p-4 sm:grid-cols-2 lg:mt-0 lg:grid lg:grid-cols-6 lg:items-end',
        )}
      >
        <Field label="Status" id={`${id}-status`}>
          <select id={`${id}-status`} className={selectClass} value={filters.status} onChange={(e) => set({ status: e.target.value as RoundsFilters['status'] })}>
            <option value="open">All open cases</option>
            {CASE_STATUSES.map((status) => (
              <option key={status} value={status}>
                {STATUS_LABELS[status]}
              </option>
            ))}
            <option value="all">Any status</option>
          </select>
        </Field>
        <Field label="Stage" id={`${id}-stage`}>
          <select id={`${id}-stage`} className={selectClass} value={filters.stage ?? ''} onChange={(e) => set({ stage: (e.target.value || null) as RoundsFilters['stage'] })}>
            <option value="">Any stage</option>
            {STAGES.map((stage) => (
              <option key={stage.id} value={stage.id}>
                {stage.label}
              </option>
            ))}
          </select>
        </Field>
        <Field label="Symptom" id={`${id}-symptom`}>
          <select
            id={`${id}-symptom`}
            className={selectClass}
            value={filters.symptom ?? ''}
            onChange={(e) => set({ symptom: (e.target.value || null) as RoundsFilters['symptom'] })}
          >
            <option value="">Any symptom</option>
            {SYMPTOM_GROUPS.map((group) => (
              <optgroup key={group.id} label={group.label}>
                {SYMPTOMS.filter((s) => s.group === group.id).map((symptom) => (
                  <option key={symptom.id} value={symptom.id}>
                    {symptom.label}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </Field>
        <Field label="Opened" id={`${id}-age`}>
          <select id={`${id}-age`} className={selectClass} value={filters.age ?? ''} onChange={(e) => set({ age: (e.target.value || null) as RoundsFilters['age'] })}>
            <option value="">Any time</option>
            {AGE_BANDS.map((band) => (
              <option key={band.id} value={band.id}>
                {band.label}
              </option>
            ))}
          </select>
        </Field>
        <Field label="Order" id={`${id}-sort`}>
          <select id={`${id}-sort`} className={selectClass} value={filters.sort} onChange={(e) => set({ sort: e.target.value as RoundsSort })}>
            {(Object.keys(SORT_WORDS) as RoundsSort[]).map((sort) => (
              <option key={sort} value={sort}>
                {SORT_WORDS[sort]}
              </option>
            ))}
          </select>
        </Field>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2 lg:flex-col lg:items-start lg:gap-1">
          <label className="inline-flex min-h-11 cursor-pointer items-center gap-2 font-bold">
            <input type="checkbox" className="size-5 accent-moss" checked={filters.mine} onChange={(e) => set({ mine: e.target.checked })} />
            Only cases I hold
          </label>
          {changed && (
            <Button variant="quiet" className="px-2!" onClick={() => choose(DEFAULT_FILTERS)}>
              Clear filters
            </Button>
          )}
        </div>
      </form>
    </div>
  );
}
