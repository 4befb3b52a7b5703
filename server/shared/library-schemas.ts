// The Field Library's contract (PRODUCT.md screen 8) and the mentor profile (screen 9): the
// limits of the list's query and the shapes the routes answer. No zod here, so the library's
// pages can read these without loading it; the query's schema is in library-query.ts.
import type { Outcome } from './outcomes';
import type { RemedyRecord, TrackRecord } from './remedy-records';

export const LIBRARY_KINDS = ['guide', 'note'] as const;
export type LibraryKind = (typeof LIBRARY_KINDS)[number];
export const MAX_QUERY_CHARS = 200;
export const LIBRARY_PAGE_SIZE = 20;

export type { LibraryQuery } from './library-query';

/** A remedy's record as a card shows it. */
export type RemedyRecordView = RemedyRecord & { text: string };

export interface LibraryListItem {
  slug: string;
  kind: LibraryKind;
  title: string;
  summary: string;
  stages: string[];
  symptoms: string[];
  cause: string | null;
  remedy: string | null;
  outcome: Outcome | null;
  publishedAt: string;
  remedyRecord: RemedyRecordView | null;
}

export interface LibraryList {
  items: LibraryListItem[];
  total: number;
  page: number;
  pageSize: number;
  /** misspelt query words and the known words they were read as */
  readAs: Record<string, string[]>;
  /** every remedy with a record, best first by the lower bound of its 95 % Wilson interval */
  remedyRecords: RemedyRecordView[];
}

export interface LibraryPhoto {
  url: string;
  thumbUrl: string;
  width: number;
  height: number;
}

export interface LibraryEntry extends LibraryListItem {
  body: string;
  sources: string[];
  updatedAt: string;
  /** field notes only */
  note: {
    stars: number | null;
    daysToResolve: number | null;
    photos: LibraryPhoto[];
  } | null;
}

/** GET /api/mentors (mentors and stewards only): who a case can be handed to. */
export interface MentorChoice {
  id: number;
  displayName: string;
  /** the open cases they hold now, so the load can be shared fairly */
  openCases: number;
}

export interface MentorChoiceList {
  items: MentorChoice[];
  total: number;
  page: number;
  pageSize: number;
}

/** GET /api/mentors/:id */
export interface MentorProfile {
  id: number;
  displayName: string;
  role: 'mentor' | 'steward';
  about: string | null;
  memberSince: string;
  casesHelped: number;
  casesOpen: number;
  /** over the cases they hold that got a first reply */
  medianHoursToFirstReply: number | null;
  repliesCounted: number;
  record: TrackRecord & { text: string };
  recentNotes: Array<Pick<LibraryListItem, 'slug' | 'title' | 'stages' | 'outcome' | 'publishedAt' | 'remedy'>>;
}
