// The cautions and readings a fix body carries, and the remedy's pointer back to a caution shown above it.
import { describe, expect, it } from 'vitest';
import { bodyNotes, sameReading, sameWords } from '@/server/render/body-notes';
import { renderFixBody } from '@/server/render/fix-body';

const body = {
  type: 'doc',
  content: [
    { type: 'caution', attrs: { kind: 'mains' }, content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Unplug it first.' }] }] },
    { type: 'paragraph', content: [{ type: 'text', text: 'Open the case.' }] },
    { type: 'reading', attrs: { testPoint: 'TP3', expected: '12 V', measured: '9 V', note: '' } },
  ],
};

describe('bodyNotes', () => {
  it('finds the body’s cautions with their words and its readings, in order', () => {
    expect(bodyNotes(body)).toEqual({
      cautions: [{ kind: 'mains', text: 'Unplug it first.' }],
      readings: [{ testPoint: 'TP3', expected: '12 V', measured: '9 V', note: '' }],
    });
  });

  it('answers nothing for a body it cannot read', () => {
    expect(bodyNotes({ type: 'not-a-doc' })).toEqual({ cautions: [], readings: [] });
  });
});

describe('sameReading and sameWords', () => {
  it('match regardless of spacing and case, and not across different values', () => {
    expect(sameReading({ testPoint: 'tp3 ', expected: '12  V' }, { testPoint: 'TP3', expected: '12 V' })).toBe(true);
    expect(sameReading({ testPoint: 'TP3', expected: '5 V' }, { testPoint: 'TP3', expected: '12 V' })).toBe(false);
    expect(sameWords('Unplug  it first.', 'unplug it first.')).toBe(true);
  });
});

describe('renderFixBody with cautions shown above', () => {
  it('renders the remedy’s caution as a link to the one shown in full, and its words not at all', () => {
    const { html } = renderFixBody(body, { cautionsShownAbove: true });
    expect(html).toContain('href="#caution-mains"');
    expect(html).not.toContain('Unplug it first.');
    expect(html).toContain('Open the case.');
    expect(renderFixBody(body).html).toContain('Unplug it first.');
  });
});
