import { useId, useState, type FormEvent } from 'react';
import { LIBRARY_KINDS, MAX_QUERY_CHARS, type LibraryKind } from '@shared/library-schemas';
import { STAGES, SYMPTOM_GROUPS, SYMPTOMS, type StageId } from '@shared/vocabulary';
import { Button } from '../../../components/ui/button';
import { useAddressFilters } from '../../../lib/use-address-filters';
import type { LibrarySearch } from '../api/search-library';

const KIND_LABELS: Record<LibraryKind | 'all', string> = { all: 'Everything', guide: 'Guides', note: 'Field notes' };
const selectClasses = 'min-h-12 w-full rounded-soft border-2 border-loam-soft bg-rice px-3 py-2 text-lg text-loam';

/** Words, stage, sign and kind. The words go on "Search"; a filter applies as soon as it changes. */
export function LibrarySearchForm({ search: address, onChange }: { search: LibrarySearch; onChange: (next: LibrarySearch) => void }) {
  const id = useId();
  const [search, choose] = useAddressFilters(address, onChange);
  const [words, setWords] = useState(search.q ?? '');
  // A new address (back button, a link) brings its words into the box.
  const [shownQ, setShownQ] = useState(search.q);
  if (shownQ !== search.q) {
    setShownQ(search.q);
    setWords(search.q ?? '');
  }
  const apply = (change: Partial<LibrarySearch>) => choose({ ...change, page: undefined });
  const submit = (event: FormEvent) => {
    event.preventDefault();
    apply({ q: words.trim() || undefined });
  };
  const symptom = search.symptom?.[0] ?? '';

  return (
    <form role="search" aria-label="Search the Field Library" onSubmit={submit} className="flex flex-col gap-4">
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-q`} className="font-bold">
          Search in your own words
        </label>
        <p id={`${id}-q-hint`} className="text-base text-loam-soft">
          For example “jar bubbling and sour” or “pink on the rice”. Spelling does not have to be right.
        </p>
        <div className="flex flex-col gap-2 sm:flex-row">
          <input
            id={`${id}-q`}
            type="search"
            name="q"
            value={words}
            maxLength={MAX_QUERY_CHARS}
            onChange={(e) => setWords(e.target.value)}
            aria-describedby={`${id}-q-hint`}
            autoComplete="off"
            enterKeyHint="search"
            className="min-h-12 w-full rounded-soft border-2 border-loam-soft bg-rice px-3 py-2 text-lg text-loam"
          />
          <Button type="submit" className="sm:w-auto">
            Search
          </Button>
        </div>
      </div>

      <div className="grid gap-4 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-stage`} className="font-bold">
            Stage
          </label>
          <select id={`${id}-stage`} value={search.stage ?? ''} onChange={(e) => apply({ stage: (e.target.value || undefined) as StageId | undefined })} className={selectClasses}>
            <option value="">All stages</option>
            {STAGES.map((s) => (
              <option key={s.id} value={s.id}>
                {s.label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-symptom`} className="font-bold">
            What the batch is doing
          </label>
          <select id={`${id}-symptom`} value={symptom} onChange={(e) => apply({ symptom: e.target.value ? [e.target.value] : undefined })} className={selectClasses}>
            <option value="">Any sign</option>
            {SYMPTOM_GROUPS.map((group) => (
              <optgroup key={group.id} label={group.label}>
                {SYMPTOMS.filter((s) => s.group === group.id).map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.label}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </div>
        <fieldset className="flex flex-col gap-1 sm:col-span-2">
          <legend className="font-bold">Show</legend>
          <div className="flex flex-wrap gap-2">
            {(['all', ...LIBRARY_KINDS] as const).map((kind) => {
              const checked = (search.kind ?? 'all') === kind;
              return (
                <label
                  key={kind}
                  className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-soft border-2 px-3 font-bold has-focus-visible:outline-3 has-focus-visible:outline-loam ${checked ? 'border-moss-deep bg-moss-mist text-moss-deep' : 'border-line bg-rice'}`}
                >
                  <input
                    type="radio"
                    name={`${id}-kind`}
                    value={kind}
                    checked={checked}
                    onChange={() => apply({ kind: kind === 'all' ? undefined : kind })}
                    className="size-4 accent-moss-deep"
                  />
                  {KIND_LABELS[kind]}
                </label>
              );
            })}
          </div>
        </fieldset>
      </div>
    </form>
  );
}
