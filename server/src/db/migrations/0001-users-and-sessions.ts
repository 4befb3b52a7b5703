import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`CREATE EXTENSION IF NOT EXISTS pg_trgm`);
  await q(`CREATE EXTENSION IF NOT EXISTS citext`);
  await q(`
    CREATE TABLE users (
      id              serial PRIMARY KEY,
      email           citext NOT NULL UNIQUE,
      display_name    text NOT NULL CHECK (char_length(display_name) BETWEEN 1 AND 60),
      password_hash   text NOT NULL,
      role            text NOT NULL DEFAULT 'grower' CHECK (role IN ('grower', 'mentor', 'steward')),
      email_verified  boolean NOT NULL DEFAULT false,
      disabled        boolean NOT NULL DEFAULT false,
      about           text,
      notify_urgent   boolean NOT NULL DEFAULT false,
      created_at      timestamptz NOT NULL DEFAULT now(),
      updated_at      timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX users_role_idx ON users (role)`);

  // connect-pg-simple's own table shape (its table.sql), made here because it creates nothing
  // unless asked. The user id column lets us end every session of a user at once.
  await q(`
    CREATE TABLE session (
      sid     varchar NOT NULL PRIMARY KEY,
      sess    json NOT NULL,
      expire  timestamp(6) NOT NULL
    )`);
  await q(`CREATE INDEX session_expire_idx ON session (expire)`);
  await q(`CREATE INDEX session_user_idx ON session (((sess -> 'passport' ->> 'user')))`);

  // Failed sign-ins, per account, for throttling that holds whatever IP the attempts come from.
  await q(`
    CREATE TABLE sign_in_failures (
      id          bigserial PRIMARY KEY,
      email       citext NOT NULL,
      ip          text,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX sign_in_failures_email_idx ON sign_in_failures (email, created_at)`);

  // Every e-mail goes through this outbox, written in the same transaction as the event that
  // causes it, and a worker sends it with retries; a mail server outage loses nothing.
  await q(`
    CREATE TABLE outbox_mail (
      id              bigserial PRIMARY KEY,
      to_address      text NOT NULL,
      subject         text NOT NULL,
      body_text       text NOT NULL,
      kind            text NOT NULL DEFAULT 'general',
      dedupe_key      text UNIQUE,
      status          text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'sent', 'failed')),
      attempts        integer NOT NULL DEFAULT 0,
      next_attempt_at timestamptz NOT NULL DEFAULT now(),
      last_error      text,
      sent_at         timestamptz,
      created_at      timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX outbox_mail_due_idx ON outbox_mail (next_attempt_at) WHERE status = 'pending'`);

  // What the local mail catcher received, so a steward can read it on the steward desk.
  await q(`
    CREATE TABLE caught_mail (
      id          bigserial PRIMARY KEY,
      envelope_to text NOT NULL,
      subject     text,
      body_text   text,
      raw         text NOT NULL,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);

  // Single-use tokens for e-mail verification and password reset; only their hash is stored.
  await q(`
    CREATE TABLE user_tokens (
      id          bigserial PRIMARY KEY,
      user_id     integer NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      purpose     text NOT NULL CHECK (purpose IN ('verify_email', 'reset_password')),
      token_hash  text NOT NULL UNIQUE,
      expires_at  timestamptz NOT NULL,
      used_at     timestamptz,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);

  await q(`
    CREATE TABLE audit_log (
      id          bigserial PRIMARY KEY,
      actor_id    integer REFERENCES users(id) ON DELETE SET NULL,
      action      text NOT NULL,
      target_type text,
      target_id   text,
      detail      jsonb NOT NULL DEFAULT '{}'::jsonb,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX audit_log_created_idx ON audit_log (created_at DESC)`);

  // Which one-off data loads (the demo) have run, so a restart never seeds twice.
  await q(`CREATE TABLE seed_runs (name text PRIMARY KEY, ran_at timestamptz NOT NULL DEFAULT now())`);
}

export async function down({ context }: Migration): Promise<void> {
  for (const table of ['seed_runs', 'audit_log', 'user_tokens', 'caught_mail', 'outbox_mail', 'sign_in_failures', 'session', 'users']) {
    await context.sequelize.query(`DROP TABLE IF EXISTS ${table}`);
  }
}
