// Photo uploads for a fix: drop, paste or pick several; alt text is asked first; each upload shows its progress.
import { useEffect, useId, useRef, useState } from 'react';
import { precheckPhoto, uploadPhoto, waitForPhoto } from './editor/upload-xhr';
import { imageFilesOf } from './editor/paste';
import type { PhotoRefData } from '../lib/writing/editor-data';

type ItemStatus = 'describe' | 'uploading' | 'processing' | 'done' | 'error';

interface QueueItem {
  key: number;
  file: File;
  preview: string;
  alt: string;
  caption: string;
  status: ItemStatus;
  progress: number;
  message: string | null;
  /** Pasted into the remedy: placed there as a picture once ready. */
  insert: boolean;
}

export interface IncomingFiles {
  files: File[];
  insert: boolean;
  /** Changes with every batch, so the same files pasted twice still arrive. */
  batch: number;
}

interface PhotoUploaderProps {
  onReady: (photo: PhotoRefData, insertIntoRemedy: boolean) => void;
  incoming: IncomingFiles | null;
}

let nextKey = 1;

export default function PhotoUploader({ onReady, incoming }: PhotoUploaderProps) {
  const id = useId();
  const [queue, setQueue] = useState<QueueItem[]>([]);
  const [dragging, setDragging] = useState(false);
  const cancelled = useRef({ cancelled: false });
  const patch = (key: number, change: Partial<QueueItem>) =>
    setQueue((q) => q.map((item) => (item.key === key ? { ...item, ...change } : item)));

  const add = (files: File[], insert: boolean) => {
    const items = files.map((file): QueueItem => {
      const problem = precheckPhoto(file);
      return {
        key: nextKey++,
        file,
        preview: URL.createObjectURL(file),
        alt: '',
        caption: '',
        status: problem ? 'error' : 'describe',
        progress: 0,
        message: problem,
        insert,
      };
    });
    setQueue((q) => [...q, ...items]);
    setTimeout(() => document.getElementById(`${id}-alt-${items.find((i) => i.status === 'describe')?.key}`)?.focus(), 0);
  };

  useEffect(() => {
    if (incoming && incoming.files.length > 0) add(incoming.files, incoming.insert);
  }, [incoming?.batch]);

  useEffect(() => {
    const flag = cancelled.current;
    return () => {
      flag.cancelled = true;
    };
  }, []);

  const upload = async (item: QueueItem) => {
    if (item.alt.trim() === '')
      return patch(item.key, { message: 'Describe what the photo shows first (alt text), for readers who cannot see it.' });
    patch(item.key, { status: 'uploading', progress: 0, message: null });
    const sent = await uploadPhoto(item.file, { alt: item.alt.trim(), caption: item.caption.trim() }, (progress) =>
      patch(item.key, { progress }),
    );
    if (!sent.ok) return patch(item.key, { status: 'error', message: sent.failure.message });
    if ('duplicateOf' in sent.data) {
      if (!sent.data.photo) return patch(item.key, { status: 'error', message: sent.data.message });
      patch(item.key, { status: 'done', progress: 1, message: sent.data.message });
      return onReady(sent.data.photo, item.insert);
    }
    patch(item.key, { status: 'processing', progress: 1 });
    const ready = await waitForPhoto(sent.data.photo.id, cancelled.current);
    if (!ready.ok) return patch(item.key, { status: 'error', message: ready.failure.message });
    if (ready.data.photo.state === 'failed')
      return patch(item.key, { status: 'error', message: ready.data.photo.error ?? 'The photo could not be processed.' });
    patch(item.key, { status: 'done', message: null });
    onReady(ready.data.photo, item.insert);
  };

  const waiting = queue.filter((i) => i.status === 'describe' && i.alt.trim() !== '');
  return (
    <section aria-labelledby={`${id}-title`} className="grid gap-3 font-sans">
      <h3 id={`${id}-title`} className="font-semibold">
        Add photos
      </h3>
      <div
        className={`rounded border-2 border-dashed p-4 text-center ${dragging ? 'border-teal bg-teal-wash' : 'border-rule-strong'}`}
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => {
          e.preventDefault();
          setDragging(false);
          add(imageFilesOf(e.dataTransfer), false);
        }}
        onPaste={(e) => {
          const files = imageFilesOf(e.clipboardData);
          if (files.length) {
            e.preventDefault();
            add(files, false);
          }
        }}
      >
        <p>Drop photos here, paste them, or</p>
        <label className="btn mt-2 inline-block cursor-pointer" htmlFor={`${id}-file`}>
          Choose photos…
        </label>
        <input
          id={`${id}-file`}
          type="file"
          multiple
          accept="image/jpeg,image/png,image/webp,image/avif"
          className="sr-only"
          onChange={(e) => {
            add(Array.from(e.target.files ?? []), false);
            e.target.value = '';
          }}
        />
        <p className="mt-2 text-sm text-ink-soft">JPEG, PNG, WebP or AVIF, up to 12 MB each. Camera data (location included) is removed.</p>
      </div>
      {waiting.length > 1 && (
        <div>
          <button type="button" className="btn" onClick={() => waiting.forEach((item) => void upload(item))}>
            Upload all {waiting.length} described photos
          </button>
        </div>
      )}
      <ul className="grid gap-3" role="list">
        {queue
          .filter((i) => i.status !== 'done' || i.message)
          .map((item) => (
            <li key={item.key} className="panel grid grid-cols-[6rem_1fr] gap-3 p-3">
              <img src={item.preview} alt="" className="h-20 w-24 rounded object-cover" />
              <div className="grid gap-2">
                <p className="text-sm">
                  <span className="font-mono">{item.file.name}</span> · {(item.file.size / 1024 / 1024).toFixed(1)} MB
                </p>
                {item.status === 'describe' && (
                  <>
                    <label className="text-sm font-semibold" htmlFor={`${id}-alt-${item.key}`}>
                      Alt text: what the photo shows <span aria-hidden="true">*</span>
                    </label>
                    <input
                      id={`${id}-alt-${item.key}`}
                      className="input"
                      required
                      maxLength={300}
                      value={item.alt}
                      onChange={(e) => patch(item.key, { alt: e.target.value })}
                    />
                    <label className="text-sm font-semibold" htmlFor={`${id}-caption-${item.key}`}>
                      Caption (optional, shown under it)
                    </label>
                    <input
                      id={`${id}-caption-${item.key}`}
                      className="input"
                      maxLength={500}
                      value={item.caption}
                      onChange={(e) => patch(item.key, { caption: e.target.value })}
                    />
                    <div className="flex gap-2">
                      <button type="button" className="btn" onClick={() => void upload(item)}>
                        Upload
                      </button>
                      <button type="button" className="btn-quiet" onClick={() => setQueue((q) => q.filter((i) => i.key !== item.key))}>
                        Cancel
                      </button>
                    </div>
                  </>
                )}
                {(item.status === 'uploading' || item.status === 'processing') && (
                  <div>
                    <progress
                      className="w-full"
                      max={1}
                      value={item.status === 'processing' ? undefined : item.progress}
                      aria-label={`Uploading ${item.file.name}`}
                    />
                    <p className="text-sm" aria-live="polite">
                      {item.status === 'uploading'
                        ? `Uploading… ${Math.round(item.progress * 100)} %`
                        : 'Uploaded; making the sizes readers see…'}
                    </p>
                  </div>
                )}
                {item.message && (
                  <p role="alert" className={item.status === 'error' ? 'text-sm text-brick' : 'text-sm'}>
                    {item.message}
                  </p>
                )}
                {item.status === 'error' && (
                  <div>
                    <button type="button" className="btn-quiet" onClick={() => setQueue((q) => q.filter((i) => i.key !== item.key))}>
                      Dismiss
                    </button>
                  </div>
                )}
              </div>
            </li>
          ))}
      </ul>
    </section>
  );
}
