// A toolbar with one tab stop: arrow keys, Home and End move between its buttons (roving tabindex).
import { useLayoutEffect, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { nextToolbarIndex } from './roving';

interface ToolbarProps {
  label: string;
  /** The id of the element the toolbar acts on. */
  controls: string;
  children: ReactNode;
}

const itemSelector = '[data-toolbar-item]:not([disabled])';

export function Toolbar({ label, controls, children }: ToolbarProps) {
  const ref = useRef<HTMLDivElement>(null);
  const current = useRef(0);

  // After every render (buttons come and go with the selection) exactly one enabled button is tabbable.
  useLayoutEffect(() => {
    const items = Array.from(ref.current?.querySelectorAll<HTMLElement>(itemSelector) ?? []);
    if (current.current >= items.length) current.current = Math.max(0, items.length - 1);
    items.forEach((item, i) => (item.tabIndex = i === current.current ? 0 : -1));
  });

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const items = Array.from(ref.current?.querySelectorAll<HTMLElement>(itemSelector) ?? []);
    const at = items.indexOf(document.activeElement as HTMLElement);
    if (at < 0) return;
    const next = nextToolbarIndex(at, event.key, items.length);
    if (next === null) return;
    event.preventDefault();
    current.current = next;
    items.forEach((item, i) => (item.tabIndex = i === next ? 0 : -1));
    items[next]?.focus();
  };

  const onFocus = () => {
    const items = Array.from(ref.current?.querySelectorAll<HTMLElement>(itemSelector) ?? []);
    const at = items.indexOf(document.activeElement as HTMLElement);
    if (at >= 0) current.current = at;
  };

  return (
    <div
      ref={ref}
      role="toolbar"
      aria-label={label}
      aria-controls={controls}
      // The body editor moves focus here on Alt+F10 (see BodyEditor).
      aria-keyshortcuts="Alt+F10"
      className="flex flex-wrap gap-1 border-b border-rule bg-paper-deep p-1"
      onKeyDown={onKeyDown}
      onFocus={onFocus}
    >
      {children}
    </div>
  );
}

interface ToolButtonProps {
  label: string;
  /** For toggles (bold, lists): whether it is on here; leave undefined for plain actions. */
  pressed?: boolean;
  disabled?: boolean;
  onPress: () => void;
  children: ReactNode;
  /** Keyboard shortcut to announce, e.g. "Control+B". */
  shortcut?: string;
}

export function ToolButton({ label, pressed, disabled, onPress, children, shortcut }: ToolButtonProps) {
  return (
    <button
      type="button"
      data-toolbar-item=""
      aria-label={label}
      aria-pressed={pressed}
      aria-keyshortcuts={shortcut}
      title={shortcut ? `${label} (${shortcut.replace('Control', 'Ctrl')})` : label}
      disabled={disabled}
      // Keep the editor's selection: a mouse press on the button must not move focus before the command runs.
      onMouseDown={(event) => event.preventDefault()}
      onClick={onPress}
      className={`min-w-8 rounded px-2 py-1 font-sans text-sm ${pressed ? 'bg-teal text-paper' : 'text-ink hover:bg-teal-wash'} disabled:opacity-40 focus-visible:outline focus-visible:outline-2 focus-visible:outline-teal`}
    >
      {children}
    </button>
  );
}

export function ToolSeparator() {
  return <span role="separator" aria-orientation="vertical" className="mx-1 w-px self-stretch bg-rule-strong" />;
}
