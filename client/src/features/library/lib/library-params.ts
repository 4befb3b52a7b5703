import { LIBRARY_KINDS, MAX_QUERY_CHARS, type LibraryKind } from '@shared/library-schemas';
import { STAGE_IDS, SYMPTOM_IDS, type StageId } from '@shared/vocabulary';
import type { LibrarySearch } from '../api/search-library';

/** The search as the address bar holds it; anything the server would refuse is dropped, so an
 * old or hand-edited link still opens the library. */
export function searchFromParams(params: URLSearchParams): LibrarySearch {
  const q = (params.get('q') ?? '').slice(0, MAX_QUERY_CHARS).trim();
  const stage = params.get('stage');
  const kind = params.get('kind');
  const page = Number(params.get('page'));
  const symptoms = params.getAll('symptom').filter((s) => (SYMPTOM_IDS as readonly string[]).includes(s)).slice(0, 5);
  return {
    ...(q ? { q } : {}),
    ...(stage && (STAGE_IDS as readonly string[]).includes(stage) ? { stage: stage as StageId } : {}),
    ...(kind && (LIBRARY_KINDS as readonly string[]).includes(kind) ? { kind: kind as LibraryKind } : {}),
    ...(symptoms.length ? { symptom: symptoms } : {}),
    ...(Number.isInteger(page) && page > 1 && page <= 500 ? { page } : {}),
  };
}

export function paramsFromSearch(search: LibrarySearch): URLSearchParams {
  const params = new URLSearchParams();
  if (search.q) params.set('q', search.q);
  if (search.stage) params.set('stage', search.stage);
  for (const s of search.symptom ?? []) params.append('symptom', s);
  if (search.kind) params.set('kind', search.kind);
  if (search.page && search.page > 1) params.set('page', String(search.page));
  return params;
}
