// bodyPlainText: the words of a body, one block per line, for search documents and diffs.
import { describe, expect, it } from 'vitest';
import { bodyPlainText, sanitiseBody } from '@/lib/tiptap/allowlist';
import { realisticBody } from './support/realistic-body';

describe('bodyPlainText', () => {
  it('puts each block of a realistic body on its own line, with readings, figures and table rows spelled out', () => {
    expect(bodyPlainText(realisticBody).split('\n')).toEqual([
      'Caution: stored charge',
      'The primary reservoir capacitor C801 can hold a charge after unplugging. Measure it before touching the power board.',
      'Remedy',
      'The loading belt stretches with age, so the tray stalls half-way. See the belt size chart or write to the parts desk.',
      'Old belts feel sticky, never shiny; part code BLT-92x4.',
      'Unplug the deck and wait five minutes.',
      'Remove the top cover (four screws).',
      'Keep the long screws apart.',
      'Test point: TP7 (loading motor +). Expected: 9.5 V while loading. Typical faulty reading: 0 V or pulsing. Note: Measure against chassis ground.',
      'Loading belt around the motor pulley, seen from above. The loading belt, left of the cassette housing.',
      'Underside of the deck mechanism',
      'Part | Value | Qty',
      'Loading belt | 92 mm x 4 mm flat | 1',
      'Capacitor C801, 100 uF 400 V | 1',
      'Clean the pulley with isopropyl alcohol before fitting the new belt.',
      'ERR 7 → loading time-out',
      'Test',
      'Load and eject a cassette ten times.',
    ]);
  });

  it('gives an empty string for an empty body', () => {
    expect(bodyPlainText({ type: 'doc', content: [{ type: 'paragraph' }] })).toBe('');
  });

  it('returns text as written, with markup characters left alone', () => {
    const result = sanitiseBody({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'R < 10 & "ok"' }] }] });
    if ('error' in result) throw new Error(result.error);
    expect(bodyPlainText(result.doc)).toBe('R < 10 & "ok"');
  });
});
