// The remedy's insert forms: link, reading, caution and picture, each writing one node or mark into the editor.
import { useState } from 'react';
import type { Editor, JSONContent } from '@tiptap/react';
import { NodeSelection, TextSelection } from '@tiptap/pm/state';
import { cautionKinds, cautionLabels, type CautionKind } from '@/lib/schemas/revision';
import { isSafeLinkHref } from '@/lib/tiptap/urls';
import { readingAttrsOf } from '@/lib/tiptap/nodes/reading';
import { Panel, PanelField } from './Panel';
import type { PhotoRefData } from '../../lib/writing/editor-data';

export type PanelName = 'link' | 'reading' | 'caution' | 'figure' | null;

interface PanelProps {
  editor: Editor;
  onClose: () => void;
}

export function LinkPanel({ editor, onClose }: PanelProps) {
  const [href, setHref] = useState<string>(String(editor.getAttributes('link').href ?? 'https://'));
  const [error, setError] = useState<string | null>(null);
  const apply = () => {
    if (href.trim() === '') {
      editor.chain().focus().extendMarkRange('link').unsetLink().run();
      return onClose();
    }
    if (!isSafeLinkHref(href.trim())) return setError('Links start with https://, http:// or mailto:.');
    editor.chain().focus().extendMarkRange('link').setLink({ href: href.trim() }).run();
    onClose();
  };
  return (
    <Panel title="Link" submitLabel="Apply link" onSubmit={apply} onClose={onClose} error={error}>
      <PanelField label="Address" value={href} onChange={setHref} hint="Leave empty to remove the link." />
    </Panel>
  );
}

export function ReadingPanel({ editor, onClose }: PanelProps) {
  const selected = editor.isActive('reading') ? readingAttrsOf(editor.getAttributes('reading')) : null;
  const [reading, setReading] = useState(selected ?? { testPoint: '', expected: '', measured: '', note: '' });
  const [error, setError] = useState<string | null>(null);
  const set = (field: keyof typeof reading) => (value: string) => setReading((r) => ({ ...r, [field]: value }));
  const apply = () => {
    if (!reading.testPoint.trim() || !reading.expected.trim())
      return setError('A reading needs a test point and the value a good unit shows.');
    if (selected) editor.chain().focus().updateAttributes('reading', reading).run();
    else insertBlock(editor, { type: 'reading', attrs: reading });
    onClose();
  };
  return (
    <Panel
      title={selected ? 'Change the reading' : 'Insert a reading'}
      submitLabel={selected ? 'Change reading' : 'Insert reading'}
      onSubmit={apply}
      onClose={onClose}
      error={error}
    >
      <PanelField
        label="Test point"
        required
        value={reading.testPoint}
        onChange={set('testPoint')}
        hint="Where to measure, e.g. TP12 or the 5 V rail at C512."
        maxLength={120}
      />
      <PanelField
        label="Expected"
        required
        value={reading.expected}
        onChange={set('expected')}
        hint="What a good unit shows, e.g. 5.0 V."
        maxLength={80}
      />
      <PanelField label="Typical faulty reading" value={reading.measured} onChange={set('measured')} maxLength={80} />
      <PanelField label="Note" value={reading.note} onChange={set('note')} maxLength={300} />
    </Panel>
  );
}

export function CautionPanel({ editor, onClose }: PanelProps) {
  const current = editor.isActive('caution') ? (editor.getAttributes('caution').kind as CautionKind) : null;
  const [kind, setKind] = useState<CautionKind>(current ?? 'mains');
  const apply = () => {
    if (current) editor.chain().focus().updateAttributes('caution', { kind }).run();
    else
      editor
        .chain()
        .focus()
        .insertContent({ type: 'caution', attrs: { kind }, content: [{ type: 'paragraph' }] })
        .run();
    onClose();
  };
  return (
    <Panel
      title={current ? 'Change the caution' : 'Insert a caution box'}
      submitLabel={current ? 'Change caution' : 'Insert caution'}
      onSubmit={apply}
      onClose={onClose}
    >
      <label className="block font-semibold" htmlFor="caution-kind">
        What can hurt
      </label>
      <select id="caution-kind" className="input" value={kind} onChange={(e) => setKind(e.target.value as CautionKind)}>
        {cautionKinds.map((k) => (
          <option key={k} value={k}>
            {cautionLabels[k]}
          </option>
        ))}
      </select>
      <p className="text-ink-soft">
        Put it before the step it guards. The box ends with a reminder to follow local electrical codes and licensed practice.
      </p>
    </Panel>
  );
}

export function FigurePanel({ editor, onClose, photos }: PanelProps & { photos: PhotoRefData[] }) {
  const ready = photos.filter((p) => p.state === 'ready' && p.figureSrc);
  const [photoId, setPhotoId] = useState<number | null>(ready[0]?.id ?? null);
  const apply = () => {
    const photo = ready.find((p) => p.id === photoId);
    if (photo) insertFigure(editor, photo);
    onClose();
  };
  if (ready.length === 0) {
    return (
      <Panel title="Insert a picture" submitLabel="Close" onSubmit={onClose} onClose={onClose}>
        <p>Upload a photo under “Photos” first (or paste one here); then it can be placed in the remedy.</p>
      </Panel>
    );
  }
  return (
    <Panel title="Insert a picture" submitLabel="Insert picture" onSubmit={apply} onClose={onClose}>
      <fieldset className="grid gap-1">
        <legend className="font-semibold">Photo</legend>
        {ready.map((p) => (
          <label key={p.id} className="flex items-center gap-2">
            <input type="radio" name="figure-photo" checked={photoId === p.id} onChange={() => setPhotoId(p.id)} />
            {p.thumbSrc && <img src={p.thumbSrc} alt="" className="h-10 w-14 object-cover" />}
            <span>{p.alt}</span>
          </label>
        ))}
      </fieldset>
      <p className="text-ink-soft">The picture keeps the alt text and caption given at upload.</p>
    </Panel>
  );
}

/**
 * Inserts a block that cannot hold the caret (a reading, a picture) and puts the caret on the line after it, so
 * typing carries on below it and the next insert lands after it rather than replacing it.
 */
function insertBlock(editor: Editor, content: JSONContent): void {
  editor
    .chain()
    .focus()
    .insertContent(content)
    .command(({ tr }) => {
      if (!(tr.selection instanceof NodeSelection)) return true;
      const after = tr.selection.to;
      if (!tr.doc.resolve(after).nodeAfter?.isTextblock) tr.insert(after, tr.doc.type.schema.nodes.paragraph!.create());
      tr.setSelection(TextSelection.create(tr.doc, after + 1));
      return true;
    })
    .run();
}

/** A figure node for an uploaded photo: its ~960 px JPEG, its alt text, its caption (kept apart from the alt text). */
export function insertFigure(editor: Editor, photo: PhotoRefData): void {
  if (!photo.figureSrc) return;
  insertBlock(editor, { type: 'figure', attrs: { src: photo.figureSrc, alt: photo.alt, caption: photo.caption } });
}
