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

/** Where mails about a member's own e-mail choices send them to turn one off. */
export const MAIL_SETTINGS_ANCHOR = 'mail-settings';
/** The mentors' choices, at the foot of the rounds. */
export const MENTOR_MAIL_SETTINGS_PATH = `/rounds#${MAIL_SETTINGS_ANCHOR}`;
/** Everyone's choices, on their account page. */
export const ACCOUNT_PATH = '/account';
