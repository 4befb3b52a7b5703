// The seam between the thread's rules and the live layer. Services store first and then hand
// what changed to the publishers here; the realtime layer registers itself as one when it is
// attached (several in one process in tests). Without one, nothing is sent live and nobody
// counts as viewing a case, so mail goes out as if the grower were away.
import type { CaseUpdatedPayload, ThreadMessage } from '../../../shared/socket-events';
import { log } from '../../lib/logger';

export interface ThreadChange {
  caseId: number;
  growerId: number;
  /** who holds the case after the change */
  mentorId: number | null;
  /** new messages in seq order; asides among them go to mentors and stewards only */
  messages: ThreadMessage[];
  caseUpdate?: CaseUpdatedPayload;
}

export interface PublishOptions {
  /** the socket that sent this message has its ack already and is not sent it again */
  skip?: { socketId: string; messageId: number };
}

export interface ThreadPublisher {
  publish(change: ThreadChange, options: PublishOptions): Promise<void>;
  /** Whether this person has a socket joined to the case right now. */
  isViewing(caseId: number, userId: number): Promise<boolean>;
  /** A steward hid a message: its text is dropped from every open thread. */
  messageHidden(caseId: number, messageId: number): void;
}

const publishers = new Set<ThreadPublisher>();

export function addThreadPublisher(publisher: ThreadPublisher): () => void {
  publishers.add(publisher);
  return () => publishers.delete(publisher);
}

/** Sends a stored change live. Never throws: the change is already safe in the database. */
export async function publishChange(change: ThreadChange, options: PublishOptions = {}): Promise<void> {
  for (const publisher of publishers) {
    try {
      await publisher.publish(change, options);
    } catch (error) {
      log.error('realtime.publish_failed', { caseId: change.caseId, error: (error as Error).message });
    }
  }
}

export async function isViewingCase(caseId: number, userId: number): Promise<boolean> {
  for (const publisher of publishers) {
    try {
      if (await publisher.isViewing(caseId, userId)) return true;
    } catch (error) {
      log.error('realtime.presence_failed', { caseId, error: (error as Error).message });
    }
  }
  return false;
}

/** For the moderation routes: call after a message was hidden, so open threads drop its text. */
export function announceMessageHidden(caseId: number, messageId: number): void {
  for (const publisher of publishers) publisher.messageHidden(caseId, messageId);
}
