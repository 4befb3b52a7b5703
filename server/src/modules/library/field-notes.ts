// Field notes: with the grower's consent, a recovered or lost case is copied into the Field
// Library without personal details (server/shared/anonymise.ts): no e-mail addresses, no names
// of anyone who wrote on the case (their role instead), nothing the mentor flagged, neither where
// the case nor its batch sits, and photos only when the grower agreed. The thread itself is never
// copied. Withdrawing consent deletes the copy.
import { QueryTypes, type Transaction } from 'sequelize';
import { createAnonymiser, type Anonymiser } from '../../../shared/anonymise';
import { OUTCOME_LABELS, type Outcome } from '../../../shared/closing-schemas';
import { RESOLVED_STATUSES } from '../../../shared/case-status';
import { CAUSES, REMEDIES, STAGES, SYMPTOMS, labelOf } from '../../../shared/vocabulary';
import { getSequelize } from '../../db/sequelize';
import { AppError, conflict, notFound } from '../../lib/errors';
import { log } from '../../lib/logger';
import { indexResolvedCases } from '../cases/search-index';
import { labelsOf } from './library-ranking';

export const NOTE_SOURCE = 'A Sporewell case: a community mentor’s advice and the grower’s own report of how the batch turned out. Not professional advice.';

export interface NoteSource {
  id: number;
  title: string;
  description: string;
  location: string;
  stage: string;
  symptoms: string[];
  cause: string | null;
  causeNotes: string | null;
  remedy: string | null;
  remedyNotes: string | null;
  summary: string | null;
  outcome: Outcome | null;
  stars: number | null;
  recoveryComment: string | null;
  status: string;
  consentToPublish: boolean;
  consentPhotos: boolean;
  redactTerms: string[];
  openedAt: Date;
  resolvedAt: Date | null;
  growerName: string;
  batchLocation: string | null;
  batchLabel: string | null;
  /** everyone else who wrote on the case or closed it, with their role */
  others: Array<{ displayName: string; role: string }>;
}

export interface NoteContent {
  slug: string;
  title: string;
  summary: string;
  body: string;
  detail: { stars: number | null; daysToResolve: number | null; photos: Array<{ id: number; width: number; height: number }> };
}

/** Markdown characters in someone's text are shown as typed, never as links, images or headings. */
export function escapeMarkdown(text: string): string {
  return text
    .replace(/[\\`*_{}[\]()<>#!|~]/g, '\\$&')
    .replace(/^(\s*)([-+=]|\d+[.)])(?=\s)/gm, '$1\\$2');
}

export function slugFor(title: string, caseId: number): string {
  const base = title
    .normalize('NFKD')
    .replace(/\p{M}+/gu, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  return `${base || 'field-note'}-${caseId}`;
}

export function anonymiserFor(source: NoteSource): Anonymiser {
  return createAnonymiser({
    growerNames: [source.growerName, ...source.others.filter((o) => o.role === 'grower').map((o) => o.displayName)],
    mentorNames: source.others.filter((o) => o.role !== 'grower').map((o) => o.displayName),
    flagged: [...source.redactTerms, source.location, source.batchLocation ?? '', source.batchLabel ?? ''].filter((t) => t.trim().length >= 2),
  });
}

/** The note's text, made from the case's own fields only (never the thread). */
export function buildFieldNote(source: NoteSource, photos: NoteContent['detail']['photos']): NoteContent {
  const clean = anonymiserFor(source);
  const said = (text: string | null | undefined) => escapeMarkdown(clean((text ?? '').trim()));
  const title = clean(source.title.trim());
  const outcome = source.outcome ? OUTCOME_LABELS[source.outcome] : 'No report';
  const lines = [
    '## What the grower saw',
    '',
    `**Stage:** ${escapeMarkdown(labelOf(STAGES, source.stage))}  `,
    `**Signs:** ${escapeMarkdown(source.symptoms.map((s) => labelOf(SYMPTOMS, s)).join(', ') || 'none noted')}`,
    '',
    said(source.description),
    '',
    '## Likely cause',
    '',
    `**${escapeMarkdown(source.cause ? labelOf(CAUSES, source.cause) : 'Not recorded')}.** ${said(source.causeNotes)}`.trim(),
    '',
    '## What was done',
    '',
    `**${escapeMarkdown(source.remedy ? labelOf(REMEDIES, source.remedy) : 'Not recorded')}.** ${said(source.remedyNotes)}`.trim(),
    '',
    '## How it turned out',
    '',
    `**${outcome}.**${source.stars ? ` The grower rated the advice ${source.stars} of 5.` : ''}`,
  ];
  const comment = said(source.recoveryComment);
  if (comment) lines.push('', `> ${comment.replace(/\n+/g, '\n> ')}`);
  const days =
    source.resolvedAt && source.openedAt ? Math.max(0, Math.round((new Date(source.resolvedAt).getTime() - new Date(source.openedAt).getTime()) / 86_400_000)) : null;
  return {
    slug: slugFor(title, source.id),
    title,
    summary: clean((source.summary ?? '').trim()),
    body: lines.join('\n').replace(/\n{3,}/g, '\n\n'),
    detail: { stars: source.stars, daysToResolve: days, photos },
  };
}

async function loadSource(caseId: number, transaction: Transaction): Promise<NoteSource | null> {
  const sequelize = getSequelize();
  const [row] = await sequelize.query<Omit<NoteSource, 'others'>>(
    `SELECT c.id, c.title, c.description, c.location, c.stage, c.symptoms, c.cause, c.cause_notes AS "causeNotes",
            c.remedy, c.remedy_notes AS "remedyNotes", c.summary, c.outcome, c.stars, c.recovery_comment AS "recoveryComment",
            c.status, c.consent_to_publish AS "consentToPublish", c.consent_photos AS "consentPhotos", c.redact_terms AS "redactTerms",
            c.opened_at AS "openedAt", c.resolved_at AS "resolvedAt", g.display_name AS "growerName",
            b.location AS "batchLocation", b.label AS "batchLabel"
       FROM cases c JOIN users g ON g.id = c.grower_id LEFT JOIN batches b ON b.id = c.batch_id
      WHERE c.id = $1 FOR UPDATE OF c`,
    { bind: [caseId], type: QueryTypes.SELECT, transaction },
  );
  if (!row) return null;
  const others = await sequelize.query<{ displayName: string; role: string }>(
    `SELECT DISTINCT u.display_name AS "displayName", u.role
       FROM users u
      WHERE u.id IN (SELECT author_id FROM messages WHERE case_id = $1 AND author_id IS NOT NULL
                     UNION SELECT mentor_id FROM cases WHERE id = $1 AND mentor_id IS NOT NULL
                     UNION SELECT closed_by FROM cases WHERE id = $1 AND closed_by IS NOT NULL)
        AND u.id <> (SELECT grower_id FROM cases WHERE id = $1)`,
    { bind: [caseId], type: QueryTypes.SELECT, transaction },
  );
  return { ...row, others };
}

async function inTransaction<T>(transaction: Transaction | undefined, work: (t: Transaction) => Promise<T>): Promise<T> {
  return transaction ? work(transaction) : getSequelize().transaction(work);
}

/**
 * Publishes (or refreshes) the field note of a case. Only for a recovered or lost case whose
 * grower reported the outcome and consented; otherwise a 409 and nothing is written.
 */
export async function publishFieldNote(caseId: number, transaction?: Transaction): Promise<{ slug: string }> {
  return inTransaction(transaction, async (t) => {
    const source = await loadSource(caseId, t);
    if (!source) throw notFound('That case');
    if (!(RESOLVED_STATUSES as readonly string[]).includes(source.status) || !source.outcome) {
      throw conflict('not_resolved', 'Only a case with a recovery report, recovered or lost, can become a field note.');
    }
    if (!source.consentToPublish) throw conflict('no_consent', 'The grower has not agreed to share this case, so it cannot be published.');
    const sequelize = getSequelize();
    const photos = source.consentPhotos
      ? await sequelize.query<{ id: number; width: number; height: number }>(
          `SELECT id, width, height FROM case_photos WHERE case_id = $1 AND purpose IN ('case', 'recovery') ORDER BY id`,
          { bind: [caseId], type: QueryTypes.SELECT, transaction: t },
        )
      : [];
    const note = buildFieldNote(source, photos);
    const [row] = await sequelize.query<{ slug: string }>(
      `INSERT INTO library_entries (slug, kind, case_id, title, summary, body, stages, symptoms, cause, remedy, outcome, sources, detail, labels, published_at, updated_at)
       VALUES ($1, 'note', $2, $3, $4, $5, $6::text[], $7::text[], $8, $9, $10, $11::text[], $12::jsonb, $14, COALESCE($13::timestamptz, now()), now())
       ON CONFLICT (case_id) DO UPDATE SET
         slug = EXCLUDED.slug, labels = EXCLUDED.labels, title = EXCLUDED.title, summary = EXCLUDED.summary, body = EXCLUDED.body, stages = EXCLUDED.stages,
         symptoms = EXCLUDED.symptoms, cause = EXCLUDED.cause, remedy = EXCLUDED.remedy, outcome = EXCLUDED.outcome,
         sources = EXCLUDED.sources, detail = EXCLUDED.detail, updated_at = now()
       RETURNING slug`,
      {
        bind: [
          note.slug, caseId, note.title, note.summary, note.body, [source.stage], source.symptoms, source.cause, source.remedy,
          source.outcome, [NOTE_SOURCE], JSON.stringify(note.detail), source.resolvedAt,
          labelsOf({ stages: [source.stage], symptoms: source.symptoms, cause: source.cause, remedy: source.remedy }),
        ],
        type: QueryTypes.SELECT,
        transaction: t,
      },
    );
    await sequelize.query(`UPDATE cases SET published = true, updated_at = now() WHERE id = $1`, { bind: [caseId], transaction: t });
    // The note's words are the case's words: make sure they are known to the misspelling reader.
    await indexResolvedCases([caseId], t);
    return { slug: row.slug };
  });
}

/** Takes a case's field note out of the library; returns whether there was one. */
export async function unpublishFieldNote(caseId: number, transaction?: Transaction): Promise<boolean> {
  return inTransaction(transaction, async (t) => {
    const sequelize = getSequelize();
    const deleted = await sequelize.query(`DELETE FROM library_entries WHERE case_id = $1 AND kind = 'note' RETURNING id`, {
      bind: [caseId],
      type: QueryTypes.SELECT,
      transaction: t,
    });
    await sequelize.query(`UPDATE cases SET published = false, updated_at = now() WHERE id = $1`, { bind: [caseId], transaction: t });
    return deleted.length > 0;
  });
}

/** At start-up: every case marked published (e.g. by the demo seed) that has no note yet gets one,
 * and a note written before labels were stored is refreshed. Safe to run any number of times,
 * and from two processes at once (each case is locked). */
export async function publishPendingNotes(): Promise<number> {
  const pending = await getSequelize().query<{ id: number }>(
    `SELECT c.id FROM cases c
      WHERE c.published AND c.consent_to_publish AND c.outcome IS NOT NULL AND c.status IN ('recovered', 'lost')
        AND NOT EXISTS (SELECT 1 FROM library_entries e WHERE e.case_id = c.id AND e.labels <> '')
      ORDER BY c.id`,
    { type: QueryTypes.SELECT },
  );
  let made = 0;
  for (const { id } of pending) {
    try {
      await publishFieldNote(id);
      made += 1;
    } catch (error) {
      if (error instanceof AppError) log.error('library.note_not_published', { caseId: id, reason: error.code });
      else throw error;
    }
  }
  if (made) log.info('library.notes_published', { count: made });
  return made;
}
