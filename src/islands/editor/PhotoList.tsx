// The photos attached to this revision: shown under the fix as its Photos section; each may also be placed in the remedy.
import type { PhotoRefData } from '../../lib/writing/editor-data';

interface PhotoListProps {
  photos: PhotoRefData[];
  onRemove: (id: number) => void;
  onInsert: (photo: PhotoRefData) => void;
  onMove: (id: number, by: -1 | 1) => void;
}

export function PhotoList({ photos, onRemove, onInsert, onMove }: PhotoListProps) {
  if (photos.length === 0) return <p className="font-sans text-sm text-ink-soft">No photos yet.</p>;
  return (
    <ul id="field-photoIds" className="grid gap-2 font-sans text-sm" role="list">
      {photos.map((photo, i) => (
        <li key={photo.id} className="flex items-center gap-3 rounded border border-rule p-2">
          {photo.thumbSrc ? (
            <img src={photo.thumbSrc} alt="" className="h-14 w-20 rounded object-cover" />
          ) : (
            <span className="h-14 w-20 rounded bg-paper-deep" />
          )}
          <div className="flex-1">
            <p>
              <span className="text-ink-soft">Alt text:</span> {photo.alt}
            </p>
            {photo.caption && (
              <p>
                <span className="text-ink-soft">Caption:</span> {photo.caption}
              </p>
            )}
            {photo.state !== 'ready' && (
              <p className={photo.state === 'failed' ? 'text-brick' : 'text-ink-soft'}>
                {photo.state === 'failed' ? photo.error : 'Still being processed…'}
              </p>
            )}
          </div>
          <div className="flex flex-wrap gap-1">
            <button
              type="button"
              className="btn-quiet"
              disabled={photo.state !== 'ready'}
              onClick={() => onInsert(photo)}
              aria-label={`Place “${photo.alt}” in the remedy`}
            >
              Place in remedy
            </button>
            <button
              type="button"
              className="btn-quiet"
              disabled={i === 0}
              onClick={() => onMove(photo.id, -1)}
              aria-label={`Move “${photo.alt}” up`}
            >
              ↑
            </button>
            <button
              type="button"
              className="btn-quiet"
              onClick={() => onRemove(photo.id)}
              aria-label={`Remove “${photo.alt}” from this fix`}
            >
              Remove
            </button>
          </div>
        </li>
      ))}
    </ul>
  );
}
