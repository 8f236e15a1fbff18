// The keywords the SMS provider acts on by itself, whatever the app does with the message: its documented
// defaults for a long-code number. A keyword counts only when it is the whole message.
export type KeywordKind = 'STOP' | 'START' | 'HELP';

const KEYWORDS: Record<string, KeywordKind> = {
  STOP: 'STOP',
  STOPALL: 'STOP',
  UNSUBSCRIBE: 'STOP',
  CANCEL: 'STOP',
  END: 'STOP',
  QUIT: 'STOP',
  START: 'START',
  YES: 'START',
  UNSTOP: 'START',
  HELP: 'HELP',
  INFO: 'HELP',
};

/** The provider's automatic answers to those keywords. */
export const KEYWORD_REPLIES: Record<KeywordKind, string> = {
  STOP: 'You have successfully been unsubscribed. You will not receive any more messages from this number. Reply START to resubscribe.',
  START:
    'You have successfully been re-subscribed to messages from this number. Reply HELP for help. Reply STOP to unsubscribe. Msg&Data Rates May Apply.',
  HELP: 'Reply STOP to unsubscribe. Msg&Data Rates May Apply.',
};

/** Case and surrounding spaces or punctuation do not matter: "stop", " Stop. " and "STOP!" all opt out. */
export function keywordOf(body: string): KeywordKind | undefined {
  const word = body
    .trim()
    .toUpperCase()
    .replace(/^[^A-Z]+|[^A-Z]+$/g, '');
  return Object.hasOwn(KEYWORDS, word) ? KEYWORDS[word] : undefined;
}
