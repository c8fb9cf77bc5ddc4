// What a page says after a plain form post was refused: the address carries only an error code, and the page
// picks one of these fixed sentences, so nobody can make a page say something of their own through a link.
const sentences: Record<string, string> = {
  bad_request: 'That was not sent in full, so nothing was changed. Fill in what the form asks for (for example a note) and send it again.',
  unauthorised: 'You were signed out, so nothing was changed. Sign in and send it again.',
  forbidden: 'Your account may not do that, so nothing was changed.',
  not_found: 'That is no longer there (it may have been withdrawn or removed), so nothing was changed.',
  conflict: 'It was changed meanwhile, so nothing was changed now. Reload the page to see where it stands, then try again.',
  too_many_requests: 'There were many tries in a short time, so nothing was changed. Wait a few minutes and try again.',
  payload_too_large: 'What was sent is too large, so nothing was changed.',
};
const fallback = 'That change was not made: something went wrong. Reload the page and try again in a minute.';

/** The sentence for an error code from the address; null when there is no code. Unknown codes get a general sentence. */
export function formErrorSentence(code: string | null | undefined): string | null {
  if (!code) return null;
  return Object.hasOwn(sentences, code) ? sentences[code]! : fallback;
}

/** What a moderator's lock or hide did, for the page the form returns to. */
export const fixFlagSentences: Record<string, string> = {
  lock: 'Locked: only moderators may write new revisions of this fix now.',
  unlock: 'Unlocked: members may write new revisions again.',
  hide: 'Hidden: readers and search no longer see this fix.',
  unhide: 'Shown again to readers and search.',
};

/** The sentence for a lock or hide that was done, or null for anything else in the address. */
export function fixFlagSentence(action: string | null | undefined): string | null {
  return action && Object.hasOwn(fixFlagSentences, action) ? fixFlagSentences[action]! : null;
}
