// The case page's conversation sits below the case, its photos and the batches like it: on a
// phone that is a long scroll. Links that are about the conversation (the case header's jump,
// the header's new-message list, the reply e-mail) carry this anchor; the thread, once its
// messages are on screen, brings its end and the composer into view.
export const CONVERSATION_ANCHOR = 'conversation';

/** The case page, from its top. */
export function casePath(caseId: number | string): string {
  return `/cases/${caseId}`;
}

/** The case page, opened at its conversation. */
export function conversationPath(caseId: number | string): string {
  return `${casePath(caseId)}#${CONVERSATION_ANCHOR}`;
}
