// Unit tests of the hand-over note code: alphabet, length, uniform use of the alphabet, normalising typed codes.
import { describe, expect, it } from 'vitest';
import {
  formatHandoverCode,
  generateHandoverCode,
  HANDOVER_ALPHABET,
  HANDOVER_CODE_LENGTH,
  handoverCodePattern,
  normaliseHandoverCode,
} from '@/lib/handover-code';

describe('HANDOVER_ALPHABET', () => {
  it('holds 31 distinct characters with none of the look-alikes 0 O 1 I L', () => {
    expect(new Set(HANDOVER_ALPHABET).size).toBe(HANDOVER_ALPHABET.length);
    expect(HANDOVER_ALPHABET.length).toBe(31);
    for (const ambiguous of ['0', 'O', '1', 'I', 'L', 'o', 'i', 'l']) expect(HANDOVER_ALPHABET).not.toContain(ambiguous);
  });

  it('gives a 10-character code about 50 bits (log2 of 31^10)', () => {
    const bits = HANDOVER_CODE_LENGTH * Math.log2(HANDOVER_ALPHABET.length);
    // log2(31) = 4.9542 (computed), so 10 characters give 49.54 bits.
    expect(bits).toBeGreaterThan(49.5);
    expect(bits).toBeLessThan(50);
  });
});

describe('generateHandoverCode', () => {
  it('makes 10 characters from the alphabet that the database pattern accepts', () => {
    for (let i = 0; i < 500; i++) {
      const code = generateHandoverCode();
      expect(code).toHaveLength(10);
      expect([...code].every((c) => HANDOVER_ALPHABET.includes(c))).toBe(true);
      expect(handoverCodePattern.test(code)).toBe(true);
    }
  });

  it('does not repeat itself across many draws', () => {
    const codes = new Set(Array.from({ length: 5000 }, () => generateHandoverCode()));
    expect(codes.size).toBe(5000);
  });

  it('throws away bytes of 248 and above so no character is favoured', () => {
    // Bytes 248..255 would map onto the first 8 characters under a plain modulo; they must be skipped.
    const bytes = [248, 255, 250, 0, 30, 31, 247];
    let calls = 0;
    const code = generateHandoverCode((n) => {
      calls++;
      return Uint8Array.from({ length: n }, (_, i) => bytes[(i + calls * 7) % bytes.length] ?? 0);
    }, 4);
    // 0 → '2', 30 → 'Z', 31 → '2', 247 → 247 % 31 = 30 → 'Z'.
    expect(code).toBe('2Z2Z');
  });

  it('maps every byte value below 248 onto the alphabet exactly evenly', () => {
    // Feeding each byte value 0..255 once: the 248 accepted bytes must give each of the 31 characters 8 times.
    let next = 0;
    const everyByte = (n: number): Uint8Array => Uint8Array.from({ length: n }, () => next++ % 256);
    const code = generateHandoverCode(everyByte, 248);
    const counts = new Map<string, number>();
    for (const c of code) counts.set(c, (counts.get(c) ?? 0) + 1);
    expect(counts.size).toBe(31);
    expect([...counts.values()].every((n) => n === 8)).toBe(true);
  });
});

describe('normaliseHandoverCode', () => {
  it('accepts lower case, spaces and dashes as typed by a customer', () => {
    expect(normaliseHandoverCode(' abcde-23456 ')).toBe('ABCDE23456');
    expect(normaliseHandoverCode('ABCDE 23456')).toBe('ABCDE23456');
  });

  it('refuses codes with look-alike characters, the wrong length or other symbols', () => {
    expect(normaliseHandoverCode('ABCDE2345O')).toBeNull();
    expect(normaliseHandoverCode('ABCDE23451')).toBeNull();
    expect(normaliseHandoverCode('ABCDE2345')).toBeNull();
    expect(normaliseHandoverCode('ABCDE23456ABCDE23')).toBeNull();
    expect(normaliseHandoverCode('ABCDE2345%')).toBeNull();
    expect(normaliseHandoverCode('')).toBeNull();
  });
});

describe('formatHandoverCode', () => {
  it('groups the code in fives for reading off paper', () => {
    expect(formatHandoverCode('ABCDE23456')).toBe('ABCDE 23456');
    expect(formatHandoverCode('ABCDE23456XY')).toBe('ABCDE 23456 XY');
  });
});
