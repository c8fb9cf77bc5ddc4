// After a 409: the live revision and the writer's own side by side, section by section; nothing typed is lost.
import { comparableFrom, diffRevisions, type ComparableRevision } from '@/lib/diff';
import type { FixDraft } from '@/lib/schemas/fix-draft';
import { cautionLabels, difficultyLabels } from '@/lib/schemas/revision-values';
import type { EditorRevisionData, LabelledRefData, PhotoRefData } from '../../lib/writing/editor-data';
import { sectionFields } from './form-helpers';
import type { MergeProposal } from './useSubmission';

export type SectionName =
  'Title' | 'Machines' | 'Symptoms' | 'Cause' | 'Difficulty and time' | 'Cautions' | 'Remedy' | 'Parts' | 'Readings' | 'Photos';

interface StaleBasePanelProps {
  live: EditorRevisionData;
  yours: { values: FixDraft; machines: LabelledRefData[]; chassis: LabelledRefData[]; photos: PhotoRefData[] };
  onTakeLive: (section: SectionName) => void;
  onRebase: () => void;
  /** The server's field merge, when it found one; `onCombine` takes it into the form and builds on the live revision. */
  merge: MergeProposal | null;
  onCombine: () => void;
  busy: boolean;
}

/** The sections a list of form fields belongs to, in the form's order. */
function sectionsOf(fields: string[]): SectionName[] {
  return (Object.keys(sectionFields) as SectionName[]).filter((section) => sectionFields[section].some((f) => fields.includes(f)));
}

interface CombinePanelProps {
  liveNumber: number;
  merge: MergeProposal;
  liveSide: ComparableRevision;
  mine: ComparableRevision;
  onCombine: () => void;
  busy: boolean;
}

/** Both edits changed different fields: the combined text, section by section, before anything is saved. */
function CombinePanel({ liveNumber, merge, liveSide, mine, onCombine, busy }: CombinePanelProps) {
  const rows = [
    ...sectionsOf(merge.theirs).map((section) => ({ section, from: `r${liveNumber}, live`, text: sectionText(section, liveSide) })),
    ...sectionsOf(merge.yours).map((section) => ({ section, from: 'your edit', text: sectionText(section, mine) })),
  ];
  return (
    <div className="mt-3 rounded border border-teal bg-paper p-3" data-merge>
      <h3 className="font-semibold">Both changes fit together</h3>
      <p className="mt-1">
        r{liveNumber} and your edit changed different parts of the fix, so nothing needs choosing. Combined, the fix reads as below in the
        sections that changed; everything else stays as it was.
      </p>
      <dl className="mt-2 grid gap-2">
        {rows.map((row) => (
          <div key={`${row.from}-${row.section}`} className="border-t border-rule pt-2">
            <dt className="font-semibold">
              {row.section} <span className="font-normal text-ink-soft">(from {row.from})</span>
            </dt>
            <dd>
              <pre className="mt-1 whitespace-pre-wrap font-sans">{row.text || '—'}</pre>
            </dd>
          </div>
        ))}
      </dl>
      <button type="button" className="btn mt-3" disabled={busy} onClick={onCombine}>
        Combine both and build on r{liveNumber}
      </button>
    </div>
  );
}

/** A section as plain lines a writer can read and copy from. */
function sectionText(section: SectionName, c: ComparableRevision): string {
  switch (section) {
    case 'Title':
      return c.title;
    case 'Machines':
      return [...c.machines, ...c.chassis].join('\n');
    case 'Symptoms':
      return [...c.symptoms, ...(c.errorCodes.length ? [`Codes: ${c.errorCodes.join(', ')}`] : [])].join('\n');
    case 'Cause':
      return c.cause;
    case 'Difficulty and time':
      return [c.difficulty ? difficultyLabels[c.difficulty] : '', c.timeMinutes ? `${c.timeMinutes} minutes` : '']
        .filter(Boolean)
        .join('\n');
    case 'Cautions':
      return c.cautions.map((k) => `${cautionLabels[k.kind]}${k.detail ? `: ${k.detail}` : ''}`).join('\n');
    case 'Remedy':
      return c.bodyText;
    case 'Parts':
      return c.parts.map((p) => [p.ref, p.value, p.rating, `× ${p.quantity}`, p.notes].filter(Boolean).join(' ')).join('\n');
    case 'Readings':
      return c.readings.map((r) => `${r.testPoint}: ${r.expected}${r.measured ? ` (faulty: ${r.measured})` : ''}`).join('\n');
    case 'Photos':
      return c.photos.map((p) => p.alt).join('\n');
  }
}

export function StaleBasePanel({ live, yours, onTakeLive, onRebase, merge, onCombine, busy }: StaleBasePanelProps) {
  const liveSide = comparableFrom({ ...live, values: live.values as FixDraft });
  const mine = comparableFrom(yours);
  const sections = diffRevisions(liveSide, mine).changedSections as SectionName[];
  return (
    <section aria-labelledby="stale-title" className="rounded border border-amber bg-amber-wash p-4 font-sans text-sm">
      <h2 id="stale-title" className="font-serif text-xl font-semibold text-amber-ink">
        The fix changed while you were writing
      </h2>
      <p className="mt-1">
        r{live.number} went live after you started. Your text is kept, in this form and on the server. Below are the sections where yours
        and the live one differ: keep yours, or take the live version of a section. Then build on r{live.number} and submit again.
      </p>
      {merge?.values && (
        <CombinePanel liveNumber={live.number} merge={merge} liveSide={liveSide} mine={mine} onCombine={onCombine} busy={busy} />
      )}
      <div className="mt-3 grid gap-3">
        {sections.map((section) => (
          <div key={section} className="rounded border border-rule bg-paper p-3">
            <h3 className="font-semibold">{section}</h3>
            <div className="mt-2 grid gap-3 md:grid-cols-2">
              <div>
                <p className="text-ink-soft">Live (r{live.number})</p>
                <pre className="mt-1 whitespace-pre-wrap font-sans">{sectionText(section, liveSide) || '—'}</pre>
              </div>
              <div>
                <p className="text-ink-soft">Yours</p>
                <pre className="mt-1 whitespace-pre-wrap font-sans">{sectionText(section, mine) || '—'}</pre>
              </div>
            </div>
            <button type="button" className="btn-quiet mt-2" onClick={() => onTakeLive(section)}>
              Use the live version of {section.toLowerCase()}
            </button>
          </div>
        ))}
        {sections.length === 0 && <p>Your text now reads the same as the live revision.</p>}
      </div>
      <button type="button" className="btn mt-3" disabled={busy} onClick={onRebase}>
        Build on r{live.number} and keep my text
      </button>
    </section>
  );
}
