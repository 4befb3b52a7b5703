// Postings for the Field Library: one row per (word, entry) for the words of an entry's title,
// summary and labels, with the word's `impact` there — Σ over the fields holding it of
// weight · norm, the fuse.js key weight (library-ranking.ts, RANKED_FIELDS) times the field's
// length norm (0302). For one reading of a query word, fuse.js's score of an entry is
// exp(ln s · impact), so the entries a word scores best in are its postings by impact, highest
// first: a common word's best 200 come from an index range scan instead of ranking the tens of
// thousands of entries that hold it.
//
// Triggers keep the rows in step with library_entries whoever writes them (publishing,
// unpublishing, the guide loader, the start-up catch-up), deletes included — in the same
// transaction, so no foreign key is needed, whose check per posting would double the cost of
// writing a note's 20–40 postings. The weights are written into the
// trigger here; tests/unit/library-postings.test.ts fails when they drift from RANKED_FIELDS,
// and a change of weights needs a migration that rewrites the function and the rows.
import type { Migration } from '../migrator';

/** fuse.js key weights 3 / 2 / 1.5, normalised to sum 1 as fuse.js does. */
export const POSTING_WEIGHTS_0304 = { title: 3 / 6.5, summary: 2 / 6.5, labels: 1.5 / 6.5 } as const;

const w = (x: number) => x.toFixed(12);

/** The posting rows of the entries `source` names (an alias `e` over library_entries columns). */
const POSTINGS_OF = (source: string) => `
  SELECT f.term, f.id, sum(f.title_i + f.summary_i + f.labels_i), sum(f.title_i), sum(f.summary_i), sum(f.labels_i), f.kind, f.stages, f.symptoms
    FROM (SELECT e.id, e.kind, e.stages, e.symptoms, t.lexeme AS term, ${w(POSTING_WEIGHTS_0304.title)} * e.title_norm AS title_i, 0::float8 AS summary_i, 0::float8 AS labels_i
            FROM ${source}, unnest(e.title_tsv) AS t
          UNION ALL
          SELECT e.id, e.kind, e.stages, e.symptoms, t.lexeme, 0, ${w(POSTING_WEIGHTS_0304.summary)} * e.summary_norm, 0 FROM ${source}, unnest(e.summary_tsv) AS t
          UNION ALL
          SELECT e.id, e.kind, e.stages, e.symptoms, t.lexeme, 0, 0, ${w(POSTING_WEIGHTS_0304.labels)} * e.labels_norm FROM ${source}, unnest(e.labels_tsv) AS t) f
   GROUP BY f.term, f.id, f.kind, f.stages, f.symptoms`;

const COLUMNS = 'term, entry_id, impact, title_impact, summary_impact, labels_impact, kind, stages, symptoms';
const NEW_ROW =
  '(SELECT NEW.id, NEW.kind, NEW.stages, NEW.symptoms, NEW.title_tsv, NEW.summary_tsv, NEW.labels_tsv, NEW.title_norm, NEW.summary_norm, NEW.labels_norm) ' +
  'AS e(id, kind, stages, symptoms, title_tsv, summary_tsv, labels_tsv, title_norm, summary_norm, labels_norm)';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  // The field impacts apart, because fuse.js takes a word's best reading per field; the filters
  // (kind, stages, symptoms) beside them, so a filtered walk never leaves the index.
  await q(`
    CREATE TABLE library_postings (
      term text NOT NULL,
      entry_id integer NOT NULL,
      impact double precision NOT NULL,
      title_impact double precision NOT NULL,
      summary_impact double precision NOT NULL,
      labels_impact double precision NOT NULL,
      kind text NOT NULL,
      stages text[] NOT NULL,
      symptoms text[] NOT NULL,
      PRIMARY KEY (term, entry_id)
    )`);
  // The scan a query word makes: its postings, strongest first, read from the index alone.
  await q(`
    CREATE INDEX library_postings_by_impact ON library_postings (term, impact DESC, entry_id DESC)
      INCLUDE (title_impact, summary_impact, labels_impact, kind, stages, symptoms)`);
  await q(`CREATE INDEX library_postings_entry ON library_postings (entry_id)`);
  // An AFTER trigger sees the generated vectors and norms of the new row.
  await q(`
    CREATE FUNCTION library_postings_refresh() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN
        DELETE FROM library_postings WHERE entry_id = OLD.id;
      END IF;
      IF TG_OP = 'DELETE' THEN
        RETURN NULL;
      END IF;
      INSERT INTO library_postings (${COLUMNS}) ${POSTINGS_OF(NEW_ROW)};
      RETURN NULL;
    END $$`);
  await q(`
    CREATE TRIGGER library_postings_on_insert AFTER INSERT ON library_entries
      FOR EACH ROW EXECUTE FUNCTION library_postings_refresh()`);
  await q(`
    CREATE TRIGGER library_postings_on_update AFTER UPDATE OF title, summary, labels, kind, stages, symptoms ON library_entries
      FOR EACH ROW EXECUTE FUNCTION library_postings_refresh()`);
  await q(`
    CREATE TRIGGER library_postings_on_delete AFTER DELETE ON library_entries
      FOR EACH ROW EXECUTE FUNCTION library_postings_refresh()`);
  await q(`INSERT INTO library_postings (${COLUMNS}) ${POSTINGS_OF('library_entries e')}`);
  // The index-only scans need the visibility map.
  await q(`ANALYZE library_postings`);
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`DROP TRIGGER IF EXISTS library_postings_on_delete ON library_entries`);
  await q(`DROP TRIGGER IF EXISTS library_postings_on_update ON library_entries`);
  await q(`DROP TRIGGER IF EXISTS library_postings_on_insert ON library_entries`);
  await q(`DROP FUNCTION IF EXISTS library_postings_refresh()`);
  await q(`DROP TABLE IF EXISTS library_postings`);
}
