// The socket.io contract between server and client (PRODUCT.md "Socket.io"; issue: rounds and
// live threads). Payloads are validated on the server with these schemas.
import { z } from 'zod';
import { MESSAGE_MAX } from './thread-limits';

export { MESSAGE_MAX };
export const messageKindSchema = z.enum(['text', 'aside']);
export type MessageKind = 'text' | 'aside' | 'system';

export const clientIdSchema = z.string().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'Not a valid message id.');

export const sendMessageSchema = z.object({
  caseId: z.number().int().positive(),
  clientId: clientIdSchema,
  body: z.string().trim().min(1, 'Write something first.').max(MESSAGE_MAX, `Keep a message under ${MESSAGE_MAX} characters.`),
  kind: messageKindSchema.default('text'),
  /** Additive: photos already uploaded to this case (POST /api/cases/:id/photos) to show with the message. */
  photoIds: z.array(z.number().int().positive()).max(6).optional(),
});
export type SendMessageInput = z.input<typeof sendMessageSchema>;

export const joinCaseSchema = z.object({ caseId: z.number().int().positive(), afterSeq: z.number().int().min(0).optional() });
export const sinceSchema = z.object({ caseId: z.number().int().positive(), afterSeq: z.number().int().min(0) });
export const leaveCaseSchema = z.object({ caseId: z.number().int().positive() });
/** `aside` (additive): typing a mentor aside is shown to mentors and stewards only. */
export const typingSchema = z.object({ caseId: z.number().int().positive(), typing: z.boolean(), aside: z.boolean().optional() });
/** A catch-up answers at most this many messages; `hasMore` then says to ask again after the last seq. */
export const CATCH_UP_MAX = 1000;

export interface ThreadPhoto {
  id: number;
  url: string;
  thumbUrl: string;
  width: number;
  height: number;
}

export interface ThreadMessage {
  id: number;
  caseId: number;
  seq: number;
  clientId: string | null;
  kind: MessageKind;
  body: string;
  /** True when a steward hid it; the body is then replaced for everyone. */
  hidden: boolean;
  author: { id: number; displayName: string; role: 'grower' | 'mentor' | 'steward' } | null;
  photos: ThreadPhoto[];
  createdAt: string;
}

export interface PresenceEntry {
  userId: number;
  displayName: string;
  role: 'grower' | 'mentor' | 'steward';
}

export type Ack<T> = { ok: true } & T | { ok: false; error: { code: string; message: string } };

export interface CaseUpdatedPayload {
  caseId: number;
  status: string;
  mentorId: number | null;
  urgency: number;
  /** Additive: the level that goes with `urgency`. */
  urgencyLevel: 'low' | 'medium' | 'high';
}

export interface ClientToServerEvents {
  'case:join': (payload: { caseId: number; afterSeq?: number }, ack: (res: Ack<{ messages: ThreadMessage[]; presence: PresenceEntry[]; hasMore: boolean }>) => void) => void;
  'case:leave': (payload: { caseId: number }) => void;
  'message:send': (payload: SendMessageInput, ack: (res: Ack<{ message: ThreadMessage; duplicate: boolean }>) => void) => void;
  /** Catch-up after a reconnect: every message after `afterSeq`, in order. */
  'message:since': (payload: { caseId: number; afterSeq: number }, ack: (res: Ack<{ messages: ThreadMessage[]; hasMore: boolean }>) => void) => void;
  'typing': (payload: { caseId: number; typing: boolean; aside?: boolean }) => void;
}

export interface ServerToClientEvents {
  'message:new': (message: ThreadMessage) => void;
  'message:hidden': (payload: { caseId: number; messageId: number }) => void;
  'presence': (payload: { caseId: number; present: PresenceEntry[] }) => void;
  'typing': (payload: { caseId: number; userId: number; displayName: string; typing: boolean }) => void;
  'case:updated': (payload: CaseUpdatedPayload) => void;
  'unread': (payload: { caseId: number }) => void;
  /** The person's role changed or their account was disabled: ask GET /api/auth/me again. The
   * socket is dropped right after (its rooms were for the old role). */
  'account:changed': () => void;
}
