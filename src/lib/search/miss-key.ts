// The form in which a search that found nothing is counted: folded words only, nothing that could name a person.
import { foldText, MAX_QUERY_LENGTH } from './tokens';

const MAX_KEY_LENGTH = 120;

/**
 * "Tray WON'T close!!" → "tray wont close". E-mail addresses, web addresses and long digit runs (phone
 * numbers, order numbers) are dropped before anything is stored. Null when nothing is left to count.
 */
export function missKey(query: string): string | null {
  const words = foldText(query.slice(0, MAX_QUERY_LENGTH))
    .split(/\s+/)
    .filter((w) => !/@|^https?:|^www\./.test(w))
    .map((w) => w.replace(/[^\p{L}\p{N}-]+/gu, ''))
    .filter((w) => w !== '' && w !== '-' && !/\d{7,}/.test(w.replace(/-/g, '')));
  const key = words.join(' ').slice(0, MAX_KEY_LENGTH).trim();
  return key === '' ? null : key;
}
