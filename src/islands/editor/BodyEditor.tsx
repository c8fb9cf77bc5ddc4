// The remedy: a Tiptap editor on the one body extension list, with its toolbar, insert forms and image paste.
import { useEffect, useId, useRef, useState } from 'react';
import { EditorContent, useEditor, type Editor } from '@tiptap/react';
import { bodyExtensions } from '@/lib/tiptap/extensions';
import '@/styles/editor-base.css';
import type { BodyDoc } from '@/lib/tiptap/allowlist';
import { BodyToolbar } from './BodyToolbar';
import { CautionPanel, FigurePanel, LinkPanel, ReadingPanel, type PanelName } from './body-panels';
import { officeListsToHtmlLists } from './office-lists';
import { imageFilesOf, pastedImageFiles } from './paste';
import type { PhotoRefData } from '../../lib/writing/editor-data';

interface BodyEditorProps {
  initial: unknown;
  onChange: (doc: BodyDoc) => void;
  photos: PhotoRefData[];
  /** Image files pasted or dropped into the remedy: they go to the uploader, which asks for alt text. */
  onImageFiles: (files: File[]) => void;
  onReady: (editor: Editor) => void;
  error?: string | undefined;
}

export function BodyEditor({ initial, onChange, photos, onImageFiles, onReady, error }: BodyEditorProps) {
  const editorId = useId();
  const errorId = `${editorId}-error`;
  const [panel, setPanel] = useState<PanelName>(null);
  // The editor is made once; its handlers read the newest callbacks through refs.
  const onChangeRef = useRef(onChange);
  const onImageFilesRef = useRef(onImageFiles);
  onChangeRef.current = onChange;
  onImageFilesRef.current = onImageFiles;
  const editor = useEditor({
    extensions: bodyExtensions(),
    content: initial as BodyDoc,
    immediatelyRender: true,
    // Its base rules come from editor-base.css: an injected <style> element would break the Content-Security-Policy.
    injectCSS: false,
    editorProps: {
      attributes: {
        id: editorId,
        role: 'textbox',
        'aria-multiline': 'true',
        'aria-label': 'Remedy: the steps that fix the fault',
        'aria-describedby': errorId,
        class: 'prose-fix min-h-[14rem] max-w-none p-3 focus:outline-none',
      },
      // Office suites paste lists as marked-up paragraphs; real lists must exist before ProseMirror parses them.
      transformPastedHTML: officeListsToHtmlLists,
      handlePaste: (_view, event) => {
        const files = pastedImageFiles(event.clipboardData);
        if (files.length === 0) return false;
        onImageFilesRef.current(files);
        return true;
      },
      // Alt+F10 goes to the toolbar from anywhere in the body: inside a table Tab moves between cells,
      // so without it a keyboard user would have to leave the table to reach the table buttons.
      handleKeyDown: (_view, event) => {
        if (!event.altKey || event.key !== 'F10') return false;
        const toolbar = document.querySelector<HTMLElement>(`[role="toolbar"][aria-controls="${CSS.escape(editorId)}"]`);
        const target =
          toolbar?.querySelector<HTMLElement>('[data-toolbar-item]:not([disabled])[tabindex="0"]') ??
          toolbar?.querySelector<HTMLElement>('[data-toolbar-item]:not([disabled])');
        if (!target) return false;
        event.preventDefault();
        target.focus();
        return true;
      },
      handleDrop: (_view, event) => {
        const files = imageFilesOf((event as DragEvent).dataTransfer);
        if (files.length === 0) return false;
        event.preventDefault();
        onImageFilesRef.current(files);
        return true;
      },
    },
    onUpdate: ({ editor: e }) => onChangeRef.current(e.getJSON() as BodyDoc),
  });

  useEffect(() => {
    if (editor) onReady(editor);
  }, [editor, onReady]);

  const close = () => {
    setPanel(null);
    // At once, not a frame later as Tiptap's focus command does: a writer who types straight after "Insert caution"
    // would otherwise lose the first keys to the panel's button as it goes away.
    editor?.view.focus();
    editor?.commands.focus();
  };

  return (
    <div className={`rounded border ${error ? 'border-brick' : 'border-rule-strong'} bg-paper`}>
      {editor && <BodyToolbar editor={editor} editorId={editorId} onOpenPanel={setPanel} />}
      {editor && panel === 'link' && <LinkPanel editor={editor} onClose={close} />}
      {editor && panel === 'reading' && <ReadingPanel editor={editor} onClose={close} />}
      {editor && panel === 'caution' && <CautionPanel editor={editor} onClose={close} />}
      {editor && panel === 'figure' && <FigurePanel editor={editor} onClose={close} photos={photos} />}
      <EditorContent editor={editor} />
      <p id={errorId} className="px-3 pb-2 font-sans text-sm text-brick empty:hidden">
        {error}
      </p>
    </div>
  );
}
