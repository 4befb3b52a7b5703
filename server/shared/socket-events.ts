// The socket.io contract between server and client (PRODUCT.md "Socket.io"; issue: rounds and
// live threads). Payloads are validated on the server with these schemas.
import { z } from 'zod';

export const MESSAGE_MAX = 5000;
export const messageKindSchema = z.enum(['text', 'aside']);
export type MessageKind = 'text' | 'aside' | 'system';

export const clientIdSchema = z.string().min(8).max(64).regex(/^[A-Za-z0-9_-]+$/, 'Not a valid message id.');

export const sendMessageSchema = z.object({
  caseId: z.number().int().positive(),
  clientId: clientIdSchema,
  body: z.string().trim().min(1, 'Write something first.').max(MESSAGE_MAX, `Keep a message under ${MESSAGE_MAX} characters.`),
  kind: messageKindSchema.default('text'),
});
export type SendMessageInput = z.input<typeof sendMessageSchema>;

export const joinCaseSchema = z.object({ caseId: z.number().int().positive(), afterSeq: z.number().int().min(0).optional() });
export const typingSchema = z.object({ caseId: z.number().int().positive(), typing: z.boolean() });

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

export interface ClientToServerEvents {
  'case:join': (payload: { caseId: number; afterSeq?: number }, ack: (res: Ack<{ messages: ThreadMessage[]; presence: PresenceEntry[] }>) => void) => void;
  'case:leave': (payload: { caseId: number }) => void;
  'message:send': (payload: SendMessageInput, ack: (res: Ack<{ message: ThreadMessage; duplicate: boolean }>) => void) => void;
  /** Catch-up after a reconnect: every message after `afterSeq`, in order. */
  'message:since': (payload: { caseId: number; afterSeq: number }, ack: (res: Ack<{ messages: ThreadMessage[] }>) => void) => void;
  'typing': (payload: { caseId: number; typing: boolean }) => void;
}

export interface ServerToClientEvents {
  'message:new': (message: ThreadMessage) => void;
  'message:hidden': (payload: { caseId: number; messageId: number }) => void;
  'presence': (payload: { caseId: number; present: PresenceEntry[] }) => void;
  'typing': (payload: { caseId: number; userId: number; displayName: string; typing: boolean }) => void;
  'case:updated': (payload: { caseId: number; status: string; mentorId: number | null; urgency: number }) => void;
  'unread': (payload: { caseId: number }) => void;
}
