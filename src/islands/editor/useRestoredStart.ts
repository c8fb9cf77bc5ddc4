// Where the form starts: the server's draft (or the live text), unless this browser holds newer unsaved edits.
import { useState } from 'react';
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import { withHeldFields, type HeldFields } from '@/lib/schemas/fix-draft-values';
import { journalScope, readJournal, shouldRestore } from './journal';
import type { FixEditorProps, LabelledRefData, PhotoRefData } from '../../lib/writing/editor-data';

export interface FormStart {
  values: FixDraftInput;
  machines: LabelledRefData[];
  chassis: LabelledRefData[];
  photos: PhotoRefData[];
  /** When the restored journal entry was edited; null when the server's copy is used. */
  restored: string | null;
  /** Fields the server holds as typed, to mark from the start (the next save answers anew for restored edits). */
  held: HeldFields;
}

export function useRestoredStart(props: FixEditorProps): FormStart {
  const [start] = useState<FormStart>(() => {
    const server = props.draft ?? { ...props.start, updatedAt: null };
    const held = props.draft?.held ?? {};
    const base: FormStart = {
      // A field the server holds comes back as it was typed, to be fixed where it stands.
      values: withHeldFields(server.values, held),
      machines: server.machines,
      chassis: server.chassis,
      photos: server.photos,
      restored: null,
      held,
    };
    let store: Storage | null = null;
    try {
      store = window.localStorage;
    } catch {
      return base;
    }
    const entry = readJournal(store, journalScope({ draftId: props.draft?.id ?? null, fixSlug: props.fixSlug }));
    if (!shouldRestore(entry, { updatedAt: props.draft?.updatedAt ?? null, values: base.values })) return base;
    // Ids come back with their labels; an id whose label was not journalled is dropped rather than shown blank.
    const known = {
      machines: [...(entry.refs?.machines ?? []), ...server.machines],
      chassis: [...(entry.refs?.chassis ?? []), ...server.chassis],
      photos: [...(entry.refs?.photos ?? []), ...server.photos],
    };
    const pick = <T extends { id: number }>(list: T[], ids: number[] | undefined): T[] =>
      (ids ?? []).map((id) => list.find((item) => item.id === id)).filter((item): item is T => item !== undefined);
    const machines = pick(known.machines, entry.values.machineIds);
    const chassis = pick(known.chassis, entry.values.chassisIds);
    const photos = pick(known.photos, entry.values.photoIds);
    return {
      values: {
        ...entry.values,
        machineIds: machines.map((m) => m.id),
        chassisIds: chassis.map((c) => c.id),
        photoIds: photos.map((p) => p.id),
      },
      machines,
      chassis,
      photos,
      restored: entry.editedAt,
      held: {},
    };
  });
  return start;
}
