// The three-way field merge of a writer's revision with the one that went live meanwhile.
import { describe, expect, it } from 'vitest';
import { mergeRevisions } from '@/server/writing/merge';
import type { FixDraft } from '@/lib/schemas/fix-draft';
import { completeValues } from '../../fixtures/writing';

const base = { ...completeValues(7, { title: 'Capstan stops after warm-up', machineIds: [7, 9] }), editSummary: '' } as FixDraft;
const newPart = { ref: 'C513', kind: 'capacitor', value: '100uF', rating: '25V', quantity: 2, notes: '' };

describe('mergeRevisions', () => {
  it('takes the live parts and the writer’s cautions when each changed only one of them', () => {
    const live = { ...base, parts: [...base.parts, newPart] } as FixDraft;
    const mine = {
      ...base,
      cautions: [...base.cautions, { kind: 'heat', detail: 'The regulator heatsink runs hot.' }],
      editSummary: 'Heat',
    };
    const merge = mergeRevisions(base, live, mine as FixDraft);
    expect(merge).toMatchObject({ yours: ['cautions'], theirs: ['parts'], clashes: [] });
    expect(merge.values?.parts).toEqual(live.parts);
    expect(merge.values?.cautions).toEqual(mine.cautions);
    expect(merge.values?.editSummary).toBe('Heat');
  });

  it('refuses to merge when both changed the same field differently, and names it', () => {
    const live = { ...base, cause: 'A dry joint on the motor plug.' };
    const mine = { ...base, cause: 'The driver capacitor has dried out.' };
    expect(mergeRevisions(base, live, mine)).toMatchObject({ clashes: ['cause'], values: null });
  });

  it('counts the same change on both sides as no clash, and machine ids in another order as no change', () => {
    const live = { ...base, timeMinutes: 60, machineIds: [9, 7] };
    const mine = { ...base, timeMinutes: 60 };
    expect(mergeRevisions(base, live, mine)).toMatchObject({ yours: [], theirs: [], clashes: [] });
  });

  it('compares parts by content, whatever the order of their keys', () => {
    const reordered = base.parts.map((p) => Object.fromEntries(Object.entries(p).reverse())) as FixDraft['parts'];
    const live = { ...base, parts: reordered };
    const mine = { ...base, symptoms: [...base.symptoms, 'Pitch drops before it stops'] };
    expect(mergeRevisions(base, live, mine)).toMatchObject({ yours: ['symptoms'], theirs: [], clashes: [] });
  });
});
