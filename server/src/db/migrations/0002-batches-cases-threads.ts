// The domain: batches on a grower's shelf, cases opened about them, the thread of each case
// (messages with a per-case sequence), photos, check-ins after closing, field notes in the
// library, mentor applications and reports of messages.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);

  await q(`
    CREATE TABLE batches (
      id            serial PRIMARY KEY,
      owner_id      integer NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      stage         text NOT NULL,
      label         text NOT NULL CHECK (char_length(label) BETWEEN 1 AND 120),
      made_on       date NOT NULL,
      ingredients   text NOT NULL DEFAULT '',
      culture_value numeric(12,3),
      culture_unit  text CHECK (culture_unit IN ('g', 'kg', 'oz', 'lb')),
      sugar_value   numeric(12,3),
      sugar_unit    text CHECK (sugar_unit IN ('g', 'kg', 'oz', 'lb')),
      sugar_type    text CHECK (sugar_type IN ('brown', 'white', 'raw')),
      moisture_pct  numeric(5,2) CHECK (moisture_pct BETWEEN 0 AND 100),
      container     text NOT NULL DEFAULT '',
      cover         text NOT NULL DEFAULT '',
      location      text NOT NULL DEFAULT '',
      notes         text NOT NULL DEFAULT '',
      created_at    timestamptz NOT NULL DEFAULT now(),
      updated_at    timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX batches_owner_idx ON batches (owner_id, made_on DESC)`);

  await q(`
    CREATE TABLE cases (
      id                 serial PRIMARY KEY,
      grower_id          integer NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      batch_id           integer REFERENCES batches(id) ON DELETE SET NULL,
      mentor_id          integer REFERENCES users(id) ON DELETE SET NULL,
      stage              text NOT NULL,
      symptoms           text[] NOT NULL DEFAULT '{}',
      title              text NOT NULL CHECK (char_length(title) BETWEEN 1 AND 140),
      description        text NOT NULL DEFAULT '',
      location           text NOT NULL DEFAULT '',
      culture_value      numeric(12,3),
      culture_unit       text,
      sugar_value        numeric(12,3),
      sugar_unit         text,
      sugar_type         text,
      moisture_pct       numeric(5,2),
      sugar_ratio        double precision,
      check_result       jsonb,
      risk               text CHECK (risk IN ('low', 'medium', 'high')),
      batch_made_on      date,
      urgency            integer NOT NULL DEFAULT 0,
      urgency_level      text NOT NULL DEFAULT 'low',
      status             text NOT NULL DEFAULT 'awaiting_mentor' CHECK (status IN
                           ('awaiting_mentor', 'in_conversation', 'over_to_grower', 'watching', 'recovered', 'lost', 'withdrawn')),
      opened_at          timestamptz NOT NULL DEFAULT now(),
      claimed_at         timestamptz,
      first_reply_at     timestamptz,
      last_message_at    timestamptz,
      last_message_preview text,
      closed_at          timestamptz,
      resolved_at        timestamptz,
      cause              text,
      cause_notes        text,
      remedy             text,
      remedy_notes       text,
      summary            text,
      ask_to_publish     boolean NOT NULL DEFAULT false,
      outcome            text CHECK (outcome IN ('recovered', 'partly', 'lost')),
      stars              smallint CHECK (stars BETWEEN 1 AND 5),
      recovery_comment   text,
      consent_to_publish boolean NOT NULL DEFAULT false,
      consent_photos     boolean NOT NULL DEFAULT false,
      published          boolean NOT NULL DEFAULT false,
      next_seq           integer NOT NULL DEFAULT 0,
      -- What "batches like this" and the library search narrow on (PostgreSQL narrows, fuse.js ranks).
      search_text        text NOT NULL DEFAULT '',
      search             tsvector GENERATED ALWAYS AS (to_tsvector('english', search_text)) STORED,
      created_at         timestamptz NOT NULL DEFAULT now(),
      updated_at         timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX cases_status_urgency_idx ON cases (status, urgency DESC, opened_at)`);
  await q(`CREATE INDEX cases_grower_idx ON cases (grower_id, opened_at DESC)`);
  await q(`CREATE INDEX cases_mentor_idx ON cases (mentor_id) WHERE mentor_id IS NOT NULL`);
  await q(`CREATE INDEX cases_symptoms_idx ON cases USING gin (symptoms)`);
  await q(`CREATE INDEX cases_search_idx ON cases USING gin (search) WHERE status IN ('recovered', 'lost')`);
  await q(`CREATE INDEX cases_resolved_stage_idx ON cases (stage) WHERE status IN ('recovered', 'lost')`);

  // Distinct words of resolved cases and guides, for typo-tolerant search: a misspelt query
  // word is matched to known words by trigram similarity, then full-text narrows.
  await q(`CREATE TABLE search_terms (term text PRIMARY KEY, uses integer NOT NULL DEFAULT 1)`);
  await q(`CREATE INDEX search_terms_trgm_idx ON search_terms USING gin (term gin_trgm_ops)`);

  await q(`
    CREATE TABLE messages (
      id          bigserial PRIMARY KEY,
      case_id     integer NOT NULL REFERENCES cases(id) ON DELETE CASCADE,
      seq         integer NOT NULL,
      author_id   integer REFERENCES users(id) ON DELETE SET NULL,
      kind        text NOT NULL CHECK (kind IN ('text', 'aside', 'system')),
      body        text NOT NULL CHECK (char_length(body) BETWEEN 1 AND 5000),
      client_id   text,
      hidden      boolean NOT NULL DEFAULT false,
      hidden_by   integer REFERENCES users(id) ON DELETE SET NULL,
      hidden_at   timestamptz,
      created_at  timestamptz NOT NULL DEFAULT now(),
      UNIQUE (case_id, seq),
      UNIQUE (case_id, client_id)
    )`);

  await q(`
    CREATE TABLE case_photos (
      id           serial PRIMARY KEY,
      case_id      integer NOT NULL REFERENCES cases(id) ON DELETE CASCADE,
      uploader_id  integer REFERENCES users(id) ON DELETE SET NULL,
      message_id   bigint REFERENCES messages(id) ON DELETE SET NULL,
      storage_key  text NOT NULL UNIQUE,
      thumb_key    text NOT NULL UNIQUE,
      width        integer NOT NULL,
      height       integer NOT NULL,
      bytes        integer NOT NULL,
      purpose      text NOT NULL DEFAULT 'case' CHECK (purpose IN ('case', 'thread', 'recovery')),
      created_at   timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX case_photos_case_idx ON case_photos (case_id)`);

  await q(`
    CREATE TABLE check_ins (
      id        serial PRIMARY KEY,
      case_id   integer NOT NULL REFERENCES cases(id) ON DELETE CASCADE,
      due_at    timestamptz NOT NULL,
      sent_at   timestamptz,
      day       integer NOT NULL,
      UNIQUE (case_id, day)
    )`);
  await q(`CREATE INDEX check_ins_due_idx ON check_ins (due_at) WHERE sent_at IS NULL`);

  // A field note is an anonymised copy of a resolved case, made with the grower's consent.
  await q(`
    CREATE TABLE library_entries (
      id          serial PRIMARY KEY,
      slug        text NOT NULL UNIQUE,
      kind        text NOT NULL CHECK (kind IN ('guide', 'note')),
      case_id     integer UNIQUE REFERENCES cases(id) ON DELETE CASCADE,
      title       text NOT NULL,
      summary     text NOT NULL DEFAULT '',
      body        text NOT NULL DEFAULT '',
      stages      text[] NOT NULL DEFAULT '{}',
      symptoms    text[] NOT NULL DEFAULT '{}',
      cause       text,
      remedy      text,
      outcome     text,
      sources     text[] NOT NULL DEFAULT '{}',
      detail      jsonb NOT NULL DEFAULT '{}'::jsonb,
      content_hash text,
      search      tsvector GENERATED ALWAYS AS (
                    setweight(to_tsvector('english', coalesce(title, '')), 'A') ||
                    setweight(to_tsvector('english', coalesce(summary, '')), 'B') ||
                    setweight(to_tsvector('english', coalesce(body, '')), 'C')) STORED,
      published_at timestamptz NOT NULL DEFAULT now(),
      updated_at  timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX library_entries_search_idx ON library_entries USING gin (search)`);
  await q(`CREATE INDEX library_entries_stages_idx ON library_entries USING gin (stages)`);
  await q(`CREATE INDEX library_entries_symptoms_idx ON library_entries USING gin (symptoms)`);
  await q(`CREATE INDEX library_entries_remedy_idx ON library_entries (remedy)`);

  await q(`
    CREATE TABLE mentor_applications (
      id          serial PRIMARY KEY,
      user_id     integer NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      experience  text NOT NULL,
      stages      text[] NOT NULL DEFAULT '{}',
      region      text NOT NULL DEFAULT '',
      status      text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'approved', 'declined')),
      decided_by  integer REFERENCES users(id) ON DELETE SET NULL,
      decided_at  timestamptz,
      note        text,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE UNIQUE INDEX mentor_applications_one_pending ON mentor_applications (user_id) WHERE status = 'pending'`);

  await q(`
    CREATE TABLE message_reports (
      id          serial PRIMARY KEY,
      message_id  bigint NOT NULL REFERENCES messages(id) ON DELETE CASCADE,
      reporter_id integer REFERENCES users(id) ON DELETE SET NULL,
      reason      text NOT NULL,
      status      text NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'hidden', 'dismissed')),
      decided_by  integer REFERENCES users(id) ON DELETE SET NULL,
      decided_at  timestamptz,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX message_reports_open_idx ON message_reports (created_at) WHERE status = 'open'`);
}

export async function down({ context }: Migration): Promise<void> {
  for (const table of ['message_reports', 'mentor_applications', 'library_entries', 'check_ins', 'case_photos', 'messages', 'search_terms', 'cases', 'batches']) {
    await context.sequelize.query(`DROP TABLE IF EXISTS ${table}`);
  }
}
