// The remedy editor's toolbar: marks, headings, lists, tables and our own blocks, with pressed states announced.
import { useEditorState, type Editor } from '@tiptap/react';
import { ToolButton, ToolSeparator, Toolbar } from './Toolbar';
import type { PanelName } from './body-panels';

interface BodyToolbarProps {
  editor: Editor;
  editorId: string;
  onOpenPanel: (panel: PanelName) => void;
}

export function BodyToolbar({ editor, editorId, onOpenPanel }: BodyToolbarProps) {
  const state = useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      bold: e.isActive('bold'),
      italic: e.isActive('italic'),
      code: e.isActive('code'),
      link: e.isActive('link'),
      h2: e.isActive('heading', { level: 2 }),
      h3: e.isActive('heading', { level: 3 }),
      bullet: e.isActive('bulletList'),
      ordered: e.isActive('orderedList'),
      inTable: e.isActive('table'),
      caution: e.isActive('caution'),
      reading: e.isActive('reading'),
      canUndo: e.can().undo(),
      canRedo: e.can().redo(),
    }),
  });
  const run = (command: (chain: ReturnType<Editor['chain']>) => ReturnType<Editor['chain']>) => () => {
    command(editor.chain().focus()).run();
    // Tiptap's focus waits for the next animation frame, and keys typed before it would land on this button and be
    // lost: the remedy takes focus now, so a writer who types at once after a click loses nothing.
    editor.view.focus();
  };
  // Each name starts with the button's visible text ("H2", "1. Steps"), so a writer using voice control can say what
  // they see (WCAG 2.5.3, label in name).
  return (
    <Toolbar label="Remedy formatting" controls={editorId}>
      <ToolButton label="Bold" shortcut="Control+B" pressed={state.bold} onPress={run((c) => c.toggleBold())}>
        <strong>B</strong>
      </ToolButton>
      <ToolButton label="Italic" shortcut="Control+I" pressed={state.italic} onPress={run((c) => c.toggleItalic())}>
        <em>I</em>
      </ToolButton>
      <ToolButton label="Code or value" pressed={state.code} onPress={run((c) => c.toggleCode())}>
        <code>{'</>'}</code>
      </ToolButton>
      <ToolButton label="Link" pressed={state.link} onPress={() => onOpenPanel('link')}>
        Link
      </ToolButton>
      <ToolSeparator />
      <ToolButton label="H2 heading" pressed={state.h2} onPress={run((c) => c.toggleHeading({ level: 2 }))}>
        H2
      </ToolButton>
      <ToolButton label="H3 subheading" pressed={state.h3} onPress={run((c) => c.toggleHeading({ level: 3 }))}>
        H3
      </ToolButton>
      <ToolButton label="Bulleted list" pressed={state.bullet} onPress={run((c) => c.toggleBulletList())}>
        • List
      </ToolButton>
      <ToolButton label="1. Steps, numbered" pressed={state.ordered} onPress={run((c) => c.toggleOrderedList())}>
        1. Steps
      </ToolButton>
      <ToolSeparator />
      <ToolButton label="Insert caution box" pressed={state.caution} onPress={() => onOpenPanel('caution')}>
        Caution
      </ToolButton>
      <ToolButton label="Insert reading" pressed={state.reading} onPress={() => onOpenPanel('reading')}>
        Reading
      </ToolButton>
      <ToolButton label="Insert picture" onPress={() => onOpenPanel('figure')}>
        Picture
      </ToolButton>
      <ToolButton
        label="Insert table"
        disabled={state.inTable}
        onPress={run((c) => c.insertTable({ rows: 3, cols: 3, withHeaderRow: true }))}
      >
        Table
      </ToolButton>
      {state.inTable && (
        <>
          <ToolButton label="Add table row below" onPress={run((c) => c.addRowAfter())}>
            + Row
          </ToolButton>
          <ToolButton label="Delete table row" onPress={run((c) => c.deleteRow())}>
            − Row
          </ToolButton>
          <ToolButton label="Add table column to the right" onPress={run((c) => c.addColumnAfter())}>
            + Col
          </ToolButton>
          <ToolButton label="Delete table column" onPress={run((c) => c.deleteColumn())}>
            − Col
          </ToolButton>
          <ToolButton label="Delete table" onPress={run((c) => c.deleteTable())}>
            × Table
          </ToolButton>
        </>
      )}
      <ToolSeparator />
      <ToolButton label="Undo" shortcut="Control+Z" disabled={!state.canUndo} onPress={run((c) => c.undo())}>
        Undo
      </ToolButton>
      <ToolButton label="Redo" shortcut="Control+Shift+Z" disabled={!state.canRedo} onPress={run((c) => c.redo())}>
        Redo
      </ToolButton>
    </Toolbar>
  );
}
