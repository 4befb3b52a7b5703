// Loads the guides shipped in knowledge/*.md into library_entries (kind 'guide') at start-up.
// Each file is Markdown with front matter (slug, title, summary, stages, symptoms, sources).
// Idempotent: a row is written only when its file's content hash changed, so a restart writes
// nothing and an edited file updates its row. Runs under a transaction-scoped advisory lock, so
// two processes starting at once take turns instead of racing. A guide whose file is gone is
// removed (`prune`). A file with bad front matter is skipped and logged, never half-loaded, and
// while one is skipped nothing is pruned.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import matter from 'gray-matter';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { STAGE_IDS, SYMPTOM_IDS } from '../../../shared/vocabulary';
import { getSequelize } from '../../db/sequelize';
import { log } from '../../lib/logger';
import { queryWords } from '../cases/search-index';
import { labelsOf } from './library-ranking';
import { invalidateRemedyRecords, SLUG_PATTERN } from './library.service';

export const KNOWLEDGE_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../../knowledge');
const KNOWLEDGE_LOCK = 727_005;

export const guideFrontMatterSchema = z.object({
  slug: z.string().regex(SLUG_PATTERN, 'slug: lower-case letters, digits and dashes'),
  title: z.string().trim().min(1).max(140),
  summary: z.string().trim().max(500).default(''),
  stages: z.array(z.enum(STAGE_IDS)).default([]),
  symptoms: z.array(z.enum(SYMPTOM_IDS)).default([]),
  sources: z.array(z.string().trim().min(1)).default([]),
});

export interface Guide extends z.infer<typeof guideFrontMatterSchema> {
  file: string;
  body: string;
  contentHash: string;
}

/** Reads and checks every guide in `dir`; files that do not parse are logged and counted. */
export function readGuides(dir: string = KNOWLEDGE_DIR): { guides: Guide[]; skipped: number } {
  const guides: Guide[] = [];
  let skipped = 0;
  const seen = new Set<string>();
  for (const file of fs.readdirSync(dir).filter((f) => f.endsWith('.md')).sort()) {
    const raw = fs.readFileSync(path.join(dir, file), 'utf8');
    try {
      // An empty options object keeps gray-matter from caching by content across calls.
      const parsed = matter(raw, {});
      const front = guideFrontMatterSchema.parse(parsed.data);
      if (seen.has(front.slug)) throw new Error(`slug ${front.slug} is used by another guide`);
      seen.add(front.slug);
      // The page shows the title as its heading; a leading "# Title" would say it twice.
      const body = parsed.content.replace(/^\s*#\s+[^\n]*\n+/, '').trim();
      guides.push({ ...front, file, body, contentHash: crypto.createHash('sha256').update(raw).digest('hex') });
    } catch (error) {
      skipped += 1;
      log.error('library.guide_skipped', { file, error: error instanceof z.ZodError ? z.prettifyError(error) : (error as Error).message });
    }
  }
  return { guides, skipped };
}

export interface LoadResult {
  inserted: string[];
  updated: string[];
  unchanged: number;
  removed: string[];
}

export async function loadKnowledge(options: { dir?: string; prune?: boolean } = {}): Promise<LoadResult> {
  const { guides, skipped } = readGuides(options.dir ?? KNOWLEDGE_DIR);
  const sequelize = getSequelize();
  const result = await sequelize.transaction(async (transaction) => {
    await sequelize.query('SELECT pg_advisory_xact_lock($1)', { bind: [KNOWLEDGE_LOCK], transaction });
    const outcome: LoadResult = { inserted: [], updated: [], unchanged: 0, removed: [] };
    for (const guide of guides) {
      const rows = await sequelize.query<{ inserted: boolean }>(
        `INSERT INTO library_entries (slug, kind, title, summary, body, stages, symptoms, sources, content_hash, labels)
         VALUES ($1, 'guide', $2, $3, $4, $5::text[], $6::text[], $7::text[], $8, $9)
         ON CONFLICT (slug) DO UPDATE SET
           title = EXCLUDED.title, summary = EXCLUDED.summary, body = EXCLUDED.body, stages = EXCLUDED.stages, labels = EXCLUDED.labels,
           symptoms = EXCLUDED.symptoms, sources = EXCLUDED.sources, content_hash = EXCLUDED.content_hash, updated_at = now()
         WHERE library_entries.kind = 'guide' AND library_entries.content_hash IS DISTINCT FROM EXCLUDED.content_hash
         RETURNING (xmax = 0) AS inserted`,
        {
          bind: [
            guide.slug, guide.title, guide.summary, guide.body, guide.stages, guide.symptoms, guide.sources, guide.contentHash,
            labelsOf({ stages: guide.stages, symptoms: guide.symptoms, cause: null, remedy: null }),
          ],
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      if (!rows.length) {
        outcome.unchanged += 1;
        continue;
      }
      (rows[0].inserted ? outcome.inserted : outcome.updated).push(guide.slug);
      // Guide words join the known words that misspelt queries are read as. A guide is not a
      // resolved case, so it adds a word once and never raises a count (ON CONFLICT DO NOTHING).
      const words = queryWords(`${guide.title}\n${guide.summary}\n${guide.body}`);
      await sequelize.query(`INSERT INTO search_terms (term, uses) SELECT w, 1 FROM unnest($1::text[]) AS w ON CONFLICT (term) DO NOTHING`, {
        bind: [words],
        transaction,
      });
    }
    // A file that failed to parse still exists: its guide stays as it was rather than vanish.
    if ((options.prune ?? true) && skipped === 0) {
      const removed = await sequelize.query<{ slug: string }>(
        `DELETE FROM library_entries WHERE kind = 'guide' AND slug <> ALL($1::text[]) RETURNING slug`,
        { bind: [guides.map((g) => g.slug)], type: QueryTypes.SELECT, transaction },
      );
      outcome.removed = removed.map((r) => r.slug);
    }
    return outcome;
  });
  if (result.inserted.length || result.updated.length || result.removed.length) {
    invalidateRemedyRecords();
    log.info('library.guides_loaded', { inserted: result.inserted.length, updated: result.updated.length, removed: result.removed.length });
  }
  return result;
}
