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
  /**
   * Of the grower and the holding mentor, who had a socket on the case when it was stored; their
   * reads were marked with it. Absent: the publisher works it out and marks them itself.
   */
  viewing?: number[];
}

export interface PublishOptions {
  /** the socket that sent this message has its ack already and is not sent it again */
  skip?: { socketId: string; messageId: number };
}

export interface ThreadPublisher {
  publish(change: ThreadChange, options: PublishOptions): Promise<void>;
  /** Who has a socket joined to each of these cases right now, in any process (person ids). */
  viewersOf?(caseIds: number[]): Map<number, Set<number>>;
  /** The same for one person and case, for publishers that cannot list (none counts as viewing without either). */
  isViewing?(caseId: number, userId: number): Promise<boolean>;
  /** A steward hid a message: its text is dropped from every open thread. */
  messageHidden(caseId: number, messageId: number): void;
  /** A steward showed a hidden message again: open threads that may read it get it back. */
  messageShown?(caseId: number, message: ThreadMessage): void;
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
  if (viewersOfCases([caseId]).get(caseId)?.has(userId)) return true;
  for (const publisher of publishers) {
    try {
      if (!publisher.viewersOf && (await publisher.isViewing?.(caseId, userId))) return true;
    } catch (error) {
      log.error('realtime.presence_failed', { caseId, error: (error as Error).message });
    }
  }
  return false;
}

/** Who has a socket joined to each case, as every publisher knows it. Never throws. */
export function viewersOfCases(caseIds: number[]): Map<number, Set<number>> {
  const merged = new Map<number, Set<number>>();
  for (const publisher of publishers) {
    try {
      for (const [caseId, users] of publisher.viewersOf?.(caseIds) ?? []) {
        const into = merged.get(caseId);
        if (into) for (const userId of users) into.add(userId);
        else merged.set(caseId, new Set(users));
      }
    } catch (error) {
      log.error('realtime.presence_failed', { caseIds: caseIds.length, error: (error as Error).message });
    }
  }
  return merged;
}

/** For the moderation routes: call after a message was hidden, so open threads drop its text. */
export function announceMessageHidden(caseId: number, messageId: number): void {
  for (const publisher of publishers) publisher.messageHidden(caseId, messageId);
}

/** For the moderation routes: call after a hidden message was shown again. */
export function announceMessageShown(caseId: number, message: ThreadMessage): void {
  for (const publisher of publishers) publisher.messageShown?.(caseId, message);
}
