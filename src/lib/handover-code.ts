// Short codes for hand-over notes: uniformly random characters from an alphabet a customer cannot misread.

/** Digits and capitals without 0/O, 1/I/L: 31 characters that survive being read aloud or retyped. */
export const HANDOVER_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXYZ';

/** 10 characters of 31 give 31^10 ≈ 8.2e14 codes, about 49.5 bits: far too many to guess. */
export const HANDOVER_CODE_LENGTH = 10;

/** What the database accepts (the same pattern as its check constraint). */
export const handoverCodePattern = /^[23456789ABCDEFGHJKMNPQRSTUVWXYZ]{10,16}$/;

/** Fills a byte array with cryptographically strong random bytes (Web Crypto, in Node and browsers alike). */
export type RandomBytes = (length: number) => Uint8Array;

const webCryptoBytes: RandomBytes = (length) => globalThis.crypto.getRandomValues(new Uint8Array(length));

/**
 * A new code. Bytes at or above 248 (the largest multiple of 31 below 256) are thrown away, so every
 * character is equally likely: taking `byte % 31` of every byte would favour the first 8 characters.
 */
export function generateHandoverCode(randomBytes: RandomBytes = webCryptoBytes, length: number = HANDOVER_CODE_LENGTH): string {
  const size = HANDOVER_ALPHABET.length;
  const limit = 256 - (256 % size);
  let code = '';
  while (code.length < length) {
    for (const byte of randomBytes(length * 2)) {
      if (byte >= limit) continue;
      code += HANDOVER_ALPHABET[byte % size];
      if (code.length === length) break;
    }
  }
  return code;
}

/**
 * A code as typed by a person: case, spaces and dashes do not matter. Characters outside the alphabet
 * (0, O, 1, I, L) make it invalid rather than being guessed at. Returns null when it cannot be a code.
 */
export function normaliseHandoverCode(input: string): string | null {
  const compact = input
    .trim()
    .toUpperCase()
    .replace(/[\s-]+/g, '');
  return handoverCodePattern.test(compact) ? compact : null;
}

/** The code in groups of five, easier to read off paper: "ABCDE 23456". */
export function formatHandoverCode(code: string): string {
  return code.replace(/(.{5})(?=.)/g, '$1 ');
}
