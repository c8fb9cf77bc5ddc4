// Unit tests of the plain-form readers: repeated rows, blank rows dropped, numbers, fields kept as typed.
import { describe, expect, it } from 'vitest';
import { fixRefFromText, formNumber, formRows, formText, typedFields } from '@/lib/form-fields';

describe('formText and formNumber', () => {
  it('trims text and treats a blank field as missing', () => {
    const form = new URLSearchParams({ a: '  hello ', b: '   ', n: ' 42 ', x: 'forty' });
    expect(formText(form, 'a')).toBe('hello');
    expect(formText(form, 'b')).toBeUndefined();
    expect(formText(form, 'missing')).toBeUndefined();
    expect(formNumber(form, 'n')).toBe(42);
    expect(formNumber(form, 'b')).toBeUndefined();
    expect(formNumber(form, 'x')).toBeNaN();
  });
});

describe('formRows', () => {
  it('reads numbered rows in order and drops rows left blank', () => {
    const form = new URLSearchParams([
      ['parts.1.value', '2k2'],
      ['parts.1.kind', 'resistor'],
      ['parts.0.value', '470uF'],
      ['parts.0.kind', 'capacitor'],
      ['parts.2.value', ''],
      ['parts.2.kind', ''],
      ['other.0.value', 'ignored'],
    ]);
    expect(formRows(form, 'parts', ['kind', 'value'])).toEqual([
      { kind: 'capacitor', value: '470uF' },
      { kind: 'resistor', value: '2k2' },
    ]);
  });
});

describe('typedFields', () => {
  it('keeps the named fields exactly as typed, spaces and line breaks included', () => {
    const form = new URLSearchParams([
      ['note', '  indented first line\n\nlast line  '],
      ['heldDays', ''],
      ['other', 'not asked for'],
    ]);
    expect(typedFields(form, ['note', 'heldDays', 'missing'])).toEqual({ note: '  indented first line\n\nlast line  ', heldDays: '' });
  });
});

describe('fixRefFromText', () => {
  it('reads a bare address, a link to the fix and a link to one revision', () => {
    expect(fixRefFromText('tl2-tray-will-not-open-e21')).toEqual({ slug: 'tl2-tray-will-not-open-e21' });
    expect(fixRefFromText('https://bench.example/fixes/tl2-tray-will-not-open-e21')).toEqual({ slug: 'tl2-tray-will-not-open-e21' });
    expect(fixRefFromText('http://127.0.0.1:4321/fixes/qm7-no-rewind/r/2#remedy')).toEqual({ slug: 'qm7-no-rewind', revision: 2 });
  });

  it('answers null for text that names no fix', () => {
    expect(fixRefFromText('Tray will not open')).toBeNull();
    expect(fixRefFromText('')).toBeNull();
    expect(fixRefFromText(undefined)).toBeNull();
  });
});
