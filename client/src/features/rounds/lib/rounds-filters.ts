// The rounds filters live in the address bar, so a mentor can bookmark "my FPJ cases" or send
// a steward a link, and the back button undoes a filter change.
import { CASE_STATUSES, type CaseStatus } from '@shared/case-status';
import { STAGE_IDS, SYMPTOM_IDS, type StageId, type SymptomId } from '@shared/vocabulary';

export const ROUNDS_SORTS = ['urgency', 'oldest', 'newest'] as const;
export type RoundsSort = (typeof ROUNDS_SORTS)[number];

/** How long a case has been open, in bands a mentor thinks in. */
export const AGE_BANDS = [
  { id: 'under-6h', label: 'Opened in the last 6 hours', minAgeHours: undefined, maxAgeHours: 6 },
  { id: '6-24h', label: '6 to 24 hours ago', minAgeHours: 6, maxAgeHours: 24 },
  { id: '1-3d', label: '1 to 3 days ago', minAgeHours: 24, maxAgeHours: 72 },
  { id: 'over-3d', label: 'More than 3 days ago', minAgeHours: 72, maxAgeHours: undefined },
] as const;
export type AgeBand = (typeof AGE_BANDS)[number]['id'];

/** `open`: every state a mentor may still have to act on; the default of the rounds. */
export type StatusFilter = CaseStatus | 'open' | 'all';

export interface RoundsFilters {
  status: StatusFilter;
  stage: StageId | null;
  symptom: SymptomId | null;
  age: AgeBand | null;
  mine: boolean;
  sort: RoundsSort;
  page: number;
}

export const ROUNDS_PAGE_SIZE = 25;

export const DEFAULT_FILTERS: RoundsFilters = { status: 'open', stage: null, symptom: null, age: null, mine: false, sort: 'urgency', page: 1 };

function oneOf<T extends string>(list: readonly T[], value: string | null): T | null {
  return value !== null && (list as readonly string[]).includes(value) ? (value as T) : null;
}

/** Unknown or hand-edited values fall back to the defaults instead of breaking the page. */
export function filtersFromSearch(params: URLSearchParams): RoundsFilters {
  const status = params.get('status');
  const page = Number(params.get('page'));
  return {
    status: status === 'all' ? 'all' : (oneOf(CASE_STATUSES, status) ?? 'open'),
    stage: oneOf(STAGE_IDS, params.get('stage')),
    symptom: oneOf(SYMPTOM_IDS, params.get('symptom')),
    age: oneOf(AGE_BANDS.map((b) => b.id), params.get('age')),
    mine: params.get('mine') === '1',
    sort: oneOf(ROUNDS_SORTS, params.get('sort')) ?? 'urgency',
    page: Number.isInteger(page) && page >= 1 ? page : 1,
  };
}

/** Only what differs from the defaults goes into the address. */
export function searchFromFilters(filters: RoundsFilters): URLSearchParams {
  const params = new URLSearchParams();
  if (filters.status !== DEFAULT_FILTERS.status) params.set('status', filters.status);
  if (filters.stage) params.set('stage', filters.stage);
  if (filters.symptom) params.set('symptom', filters.symptom);
  if (filters.age) params.set('age', filters.age);
  if (filters.mine) params.set('mine', '1');
  if (filters.sort !== DEFAULT_FILTERS.sort) params.set('sort', filters.sort);
  if (filters.page > 1) params.set('page', String(filters.page));
  return params;
}

/** The query string GET /api/cases takes. */
export function apiQueryFromFilters(filters: RoundsFilters): URLSearchParams {
  const params = new URLSearchParams();
  // Left out, the server answers the open cases, which is what `open` means here.
  if (filters.status !== 'open') params.set('status', filters.status);
  if (filters.stage) params.set('stage', filters.stage);
  if (filters.symptom) params.set('symptom', filters.symptom);
  const band = AGE_BANDS.find((b) => b.id === filters.age);
  if (band?.minAgeHours !== undefined) params.set('minAgeHours', String(band.minAgeHours));
  if (band?.maxAgeHours !== undefined) params.set('maxAgeHours', String(band.maxAgeHours));
  if (filters.mine) params.set('mine', '1');
  params.set('sort', filters.sort);
  params.set('page', String(filters.page));
  params.set('pageSize', String(ROUNDS_PAGE_SIZE));
  return params;
}
