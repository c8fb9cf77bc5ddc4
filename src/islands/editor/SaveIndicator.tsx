// Says where the writer's text is: unsaved, saving, saved at hh:mm, or not saved (with the server's reason).
import { saveLabel, type SaveState } from './save-state';

const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

const tone = {
  clean: 'text-ink-soft',
  unsaved: 'text-amber-ink',
  saving: 'text-ink-soft',
  saved: 'text-teal',
  failed: 'text-brick',
} as const;

export function SaveIndicator({ state, journalFailed }: { state: SaveState; journalFailed: boolean }) {
  const label = saveLabel(state, time);
  return (
    <p role="status" aria-live="polite" className={`font-sans text-sm ${tone[label.kind]}`} data-save-state={label.kind}>
      {label.text}
      {journalFailed && label.kind !== 'saved' && (
        <span className="block text-brick">This browser refused to keep a local copy too (storage full or private mode).</span>
      )}
    </p>
  );
}
