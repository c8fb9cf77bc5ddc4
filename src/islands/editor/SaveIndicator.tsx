// Says where the writer's text is: unsaved, saving, saved at hh:mm (and how many fields wait to be fixed), or not saved.
import { saveLabel, type SaveState } from './save-state';

const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

const tone = {
  clean: 'text-ink-soft',
  unsaved: 'text-amber-ink',
  saving: 'text-ink-soft',
  saved: 'text-teal',
  failed: 'text-brick',
} as const;

interface SaveIndicatorProps {
  state: SaveState;
  journalFailed: boolean;
  /** Fields saved as typed that must be fixed before submitting. */
  heldCount: number;
}

export function SaveIndicator({ state, journalFailed, heldCount }: SaveIndicatorProps) {
  const label = saveLabel(state, time);
  return (
    <p role="status" aria-live="polite" className={`font-sans text-sm ${tone[label.kind]}`} data-save-state={label.kind}>
      {label.text}
      {heldCount > 0 && (
        <span className="block text-amber-ink" data-held-count={heldCount}>
          {heldCount === 1 ? 'One field is saved as typed' : `${heldCount} fields are saved as typed`} and marked below; fix{' '}
          {heldCount === 1 ? 'it' : 'them'} before submitting.
        </span>
      )}
      {journalFailed && label.kind !== 'saved' && (
        <span className="block text-brick">This browser refused to keep a local copy too (storage full or private mode).</span>
      )}
    </p>
  );
}
