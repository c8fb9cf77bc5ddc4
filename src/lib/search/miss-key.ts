// The form in which a search that found nothing is counted: folded words only, nothing that could name a person.
import { foldText, MAX_QUERY_LENGTH } from './tokens';

const MAX_KEY_LENGTH = 120;
/** Seven digits or more in a row (spaces and dashes allowed between groups) reads as a phone or order number. */
const PERSONAL_DIGITS = 7;

/** Drops runs of all-digit words that together hold a phone-number's worth of digits. */
function withoutLongNumbers(words: string[]): string[] {
  const kept: string[] = [];
  let run: string[] = [];
  const flush = () => {
    if (run.join('').replace(/\D/g, '').length < PERSONAL_DIGITS) kept.push(...run);
    run = [];
  };
  for (const word of words) {
    if (/^\+?[\d()-]+$/.test(word) && /\d/.test(word)) run.push(word);
    else {
      flush();
      kept.push(word);
    }
  }
  flush();
  return kept;
}

/**
 * "Tray WON'T close!!" → "tray wont close". E-mail addresses, web addresses and long digit runs (phone
 * numbers, order numbers) are dropped before anything is stored. Null when nothing is left to count.
 */
export function missKey(query: string): string | null {
  const words = foldText(query.slice(0, MAX_QUERY_LENGTH))
    .split(/\s+/)
    .filter((w) => !/@|^https?:|^www\./.test(w));
  const cleaned = withoutLongNumbers(words)
    .map((w) => w.replace(/[^\p{L}\p{N}-]+/gu, ''))
    .filter((w) => w !== '' && w !== '-');
  const key = cleaned.join(' ').slice(0, MAX_KEY_LENGTH).trim();
  return key === '' ? null : key;
}
