// The query GET /api/library accepts (the server validates with it; the client builds the same
// fields from the address bar in features/library/lib/library-params.ts).
import { z } from 'zod';
import { LIBRARY_KINDS, LIBRARY_PAGE_SIZE, MAX_QUERY_CHARS } from './library-schemas';
import { STAGE_IDS, SYMPTOM_IDS } from './vocabulary';

const oneOrMany = <T extends z.ZodType>(item: T, max: number) =>
  z.union([item.transform((v) => [v]), z.array(item).max(max, { error: `Choose at most ${max}.` })]);

export const libraryQuerySchema = z.object({
  q: z
    .string({ error: 'Search with words.' })
    .max(MAX_QUERY_CHARS, { error: `Keep the search under ${MAX_QUERY_CHARS} characters.` })
    .optional(),
  stage: z.enum(STAGE_IDS, { error: 'That is not one of the stages Sporewell knows.' }).optional(),
  symptom: oneOrMany(z.enum(SYMPTOM_IDS, { error: 'That is not one of the symptoms Sporewell knows.' }), 5).optional(),
  kind: z.enum(LIBRARY_KINDS, { error: 'Choose guides or field notes.' }).optional(),
  page: z.coerce.number({ error: 'The page is a number.' }).int().min(1).max(500).default(1),
  pageSize: z.coerce.number({ error: 'The page size is a number.' }).int().min(1).max(50).default(LIBRARY_PAGE_SIZE),
});
export type LibraryQuery = z.output<typeof libraryQuerySchema>;
