// GET /api/cases: the rounds (mentors and stewards) and a grower's own list.
//
// Many mentors ask for the same rounds page, often several times a minute each. A page is
// built once (two prepared statements, then serialised, its ETag taken and, when someone wants
// it, gzipped) and shared by every request with the same filter (`listFilterOf`: who may see
// what is part of the key, so a grower's page is theirs alone, and mentors and stewards, who see
// different latest lines, do not share) for at most PAGE_TTL_MS, and only while nothing it
// shows has changed since it was begun. The next page is begun a quarter of that before the
// end, while the current one is still given out, so that when nothing changes nobody waits for
// a build (a build cost the whole wave of waiting requests its time, once a second).
//
// Never older than the request: each request's session was read (session-reader.ts) after it
// arrived, together with the database's change count, which every transaction that changes
// cases, their messages or people's names moves (migration 0600), on any process or connection.
// A page is given to a request only if it was begun after a read whose count was at least the
// request's own, so it holds every such change the request could know of. The time limit is for
// what moves with the clock alone (hours waiting and the urgency points they add), which is
// then at most a second behind.
import crypto from 'node:crypto';
import { promisify } from 'node:util';
import zlib from 'node:zlib';
import type { Request, RequestHandler, Response } from 'express';
import { caseListQuerySchema, type CaseListQuery } from '../../../shared/case-schemas';
import type { AppContext } from '../../context';
import { parseOr400, requireUser } from '../../lib/http';
import type { ChangeWatch } from '../../lib/session';
import { casesService, listFilterOf, type CaseListFilter } from './cases.service';

export const PAGE_TTL_MS = 1000;
/** When the next page is begun while this one is still given out, so that nobody waits for it. */
const REFRESH_AFTER_MS = 750;
const MAX_PAGES = 200;
/** Below this compression does not pay (the compression middleware's own threshold). */
const GZIP_FROM_BYTES = 1024;

const gzip = promisify(zlib.gzip);

/** A JSON answer ready to send: its bytes, a weak ETag as Express makes them, and gzip on demand. */
export interface PreparedJson {
  body: Buffer;
  etag: string;
  gzipped(): Promise<Buffer>;
}

export function prepareJson(value: unknown): PreparedJson {
  const body = Buffer.from(JSON.stringify(value));
  const hash = crypto.createHash('sha1').update(body).digest('base64').slice(0, 27);
  let zipped: Promise<Buffer> | null = null;
  return {
    body,
    etag: `W/"${body.length.toString(16)}-${hash}"`,
    gzipped: () => (zipped ??= gzip(body)),
  };
}

/**
 * Sends a prepared answer: 304 when the client has it, gzip when it accepts gzip (made once per
 * page, not per request). Written straight to the response, with the headers Express's res.send
 * would add; the compression middleware adds Vary and leaves an encoded body alone.
 */
export function sendPreparedJson(req: Request, res: Response, page: PreparedJson): void | Promise<void> {
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('ETag', page.etag);
  if (req.headers['if-none-match'] && req.fresh) {
    res.removeHeader('Content-Type');
    res.status(304).end();
    return;
  }
  if (page.body.length >= GZIP_FROM_BYTES && req.headers['accept-encoding'] && req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    return page.gzipped().then((zipped) => {
      res.setHeader('Content-Encoding', 'gzip');
      res.setHeader('Content-Length', zipped.length);
      res.end(zipped);
    });
  }
  res.setHeader('Content-Length', page.body.length);
  res.end(page.body);
}

/** Counters for tests and the bench: pages built, and answers given from a page built for an earlier request. */
export const roundsPageStats = { built: 0, shared: 0 };

interface Entry {
  /** the change count seen by the request whose read came before this page was begun */
  changes: number;
  startedAt: number;
  page: Promise<PreparedJson>;
  /** the page once built, so that a hit needs no promise */
  ready?: PreparedJson;
  /** its successor, begun REFRESH_AFTER_MS after it while it is still given out */
  next?: Entry;
}

export interface RoundsPages {
  /** the page for this request: built, or on its way */
  page(req: Request, filter: CaseListFilter): PreparedJson | Promise<PreparedJson>;
}

export function createRoundsPages(changes: ChangeWatch, build: (filter: CaseListFilter) => Promise<unknown> = (f) => casesService.listPage(f)): RoundsPages {
  const entries = new Map<string, Entry>();

  const begin = (key: string, filter: CaseListFilter, count: number, now: number): Entry => {
    roundsPageStats.built += 1;
    const entry: Entry = { changes: count, startedAt: now, page: build(filter).then(prepareJson) };
    entry.page.then(
      (built) => {
        entry.ready = built;
        // A successor takes over once built; a newer page begun meanwhile stays.
        const current = entries.get(key);
        if (current && current !== entry && current.next === entry) entries.set(key, entry);
      },
      () => {
        const current = entries.get(key);
        if (current === entry) entries.delete(key);
        else if (current?.next === entry) current.next = undefined;
      },
    );
    return entry;
  };

  return {
    page(req, filter) {
      const seen = changes.seenBy(req);
      if (seen === undefined) {
        roundsPageStats.built += 1;
        return build(filter).then(prepareJson);
      }
      const key = JSON.stringify(filter);
      const now = Date.now();
      const found = entries.get(key);
      if (found && seen <= found.changes) {
        const age = now - found.startedAt;
        if (age < PAGE_TTL_MS) {
          // Begun after a read with this count, so the successor may carry it too.
          if (age >= REFRESH_AFTER_MS && !found.next) found.next = begin(key, filter, found.changes, now);
          roundsPageStats.shared += 1;
          return found.ready ?? found.page;
        }
        if (found.next && now - found.next.startedAt < PAGE_TTL_MS) {
          roundsPageStats.shared += 1;
          return found.next.ready ?? found.next.page;
        }
      }
      const entry = begin(key, filter, seen, now);
      entries.delete(key);
      entries.set(key, entry);
      if (entries.size > MAX_PAGES) entries.delete(entries.keys().next().value!);
      return entry.page;
    },
  };
}

/**
 * The same address always means the same filters, and Express parses `req.query` afresh on every
 * read (qs, then zod): the parsed filters of the last few query strings are kept.
 */
function queryParser(limit = 100) {
  const parsed = new Map<string, CaseListQuery>();
  return (req: Request): CaseListQuery => {
    const at = req.url.indexOf('?');
    const raw = at < 0 ? '' : req.url.slice(at + 1);
    const known = parsed.get(raw);
    if (known) return known;
    const query = parseOr400(caseListQuerySchema, req.query, 'Some of the filters need fixing.');
    if (parsed.size >= limit) parsed.delete(parsed.keys().next().value!);
    parsed.set(raw, Object.freeze(query));
    return query;
  };
}

/** The route handler (mounted by cases.router.ts). */
export function listCasesHandler(ctx: AppContext): RequestHandler {
  const pages = createRoundsPages(ctx.sessions.changes);
  const parseQuery = queryParser();
  return (req, res, next) => {
    let page: PreparedJson | Promise<PreparedJson>;
    try {
      page = pages.page(req, listFilterOf(requireUser(req), parseQuery(req)));
    } catch (error) {
      return next(error);
    }
    // A page already built is sent in this same turn, without a promise.
    if (!(page instanceof Promise)) return sendPreparedJson(req, res, page);
    page.then((built) => sendPreparedJson(req, res, built)).catch(next);
  };
}
