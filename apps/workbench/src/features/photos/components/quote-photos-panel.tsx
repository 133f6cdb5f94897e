import { PHOTO_CONTENT_TYPES, PHOTO_MAX_BYTES, type QuotePhoto } from '@gloaming/contracts';
import { useId, useRef, useState, type DragEvent, type KeyboardEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { useDeleteQuotePhoto } from '../api/delete-photo';
import { useQuotePhotos } from '../api/list-photos';
import { useReorderQuotePhotos } from '../api/reorder-photos';
import { useUpdateQuotePhoto } from '../api/update-photo';
import { useUploadQuotePhoto } from '../api/upload-photo';

type UploadNote = { id: number; name: string; state: 'uploading' | 'failed'; detail?: string };

const MAX_MB = PHOTO_MAX_BYTES / 1024 / 1024;

/** Move one id by `delta` places; the same list when it cannot move. */
export function movedOrder(ids: readonly string[], id: string, delta: -1 | 1): string[] {
  const from = ids.indexOf(id);
  const to = from + delta;
  if (from < 0 || to < 0 || to >= ids.length) return [...ids];
  const next = [...ids];
  next.splice(from, 1);
  next.splice(to, 0, id);
  return next;
}

/**
 * Site photos and plan images for a quote: add by button or by dropping files, caption, order
 * and choose which go on the quote PDF. Every control works from the keyboard; Alt+↑/↓ on a
 * photo moves it.
 */
export function QuotePhotosPanel({ quoteId }: { quoteId: string }) {
  const photos = useQuotePhotos(quoteId);
  const upload = useUploadQuotePhoto(quoteId);
  const reorder = useReorderQuotePhotos(quoteId);
  const inputRef = useRef<HTMLInputElement>(null);
  const [dragging, setDragging] = useState(false);
  const [notes, setNotes] = useState<UploadNote[]>([]);
  const [announce, setAnnounce] = useState('');
  const nextNote = useRef(1);
  const headingId = useId();
  const hintId = useId();

  async function addFiles(files: FileList | File[]) {
    for (const file of Array.from(files)) {
      const id = nextNote.current++;
      if (file.size > PHOTO_MAX_BYTES) {
        setNotes((n) => [...n, { id, name: file.name, state: 'failed', detail: `Larger than ${MAX_MB} MB.` }]);
        continue;
      }
      setNotes((n) => [...n, { id, name: file.name, state: 'uploading' }]);
      try {
        await upload.mutateAsync(file);
        setNotes((n) => n.filter((x) => x.id !== id));
        setAnnounce(`${file.name} added.`);
      } catch (err) {
        const detail = err instanceof Error ? err.message : 'The upload failed.';
        setNotes((n) => n.map((x) => (x.id === id ? { ...x, state: 'failed', detail } : x)));
      }
    }
  }

  function onDrop(e: DragEvent<HTMLDivElement>) {
    e.preventDefault();
    setDragging(false);
    if (e.dataTransfer.files.length) void addFiles(e.dataTransfer.files);
  }

  const list = photos.data ?? [];
  const ids = list.map((p) => p.id);
  const move = (id: string, delta: -1 | 1) => {
    const next = movedOrder(ids, id, delta);
    if (next.join() === ids.join()) return;
    reorder.mutate(next);
    const photo = list.find((p) => p.id === id);
    setAnnounce(`${photo?.caption || 'Photo'} moved to place ${next.indexOf(id) + 1} of ${next.length}.`);
  };
  const onQuoteCount = list.filter((p) => p.onQuote).length;

  return (
    <section
      aria-labelledby={headingId}
      className="flex w-72 flex-col gap-3 rounded-card bg-surface p-4 shadow-card ring-1 ring-line"
    >
      <header className="flex items-baseline justify-between gap-2">
        <h2 id={headingId} className="text-micro font-semibold tracking-wide text-dusk-700 uppercase">
          Photos and plans
        </h2>
        <span className="text-micro text-ink-muted">
          {list.length === 0 ? 'none yet' : `${onQuoteCount} of ${list.length} on the quote`}
        </span>
      </header>

      <div
        onDragEnter={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragOver={(e) => e.preventDefault()}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        data-testid="photo-drop-zone"
        className={`flex flex-col items-center gap-2 rounded-control border-2 border-dashed px-3 py-4 text-center transition-colors ${
          dragging ? 'border-lamp-400 bg-lamp-50' : 'border-mist-300 bg-mist-50'
        }`}
      >
        <Button variant="secondary" className="h-9 px-4" onClick={() => inputRef.current?.click()} aria-describedby={hintId}>
          Add photos…
        </Button>
        <p id={hintId} className="text-micro text-ink-muted">
          or drop them here. JPEG, PNG or WebP, up to {MAX_MB} MB each.
        </p>
        <input
          ref={inputRef}
          type="file"
          accept={PHOTO_CONTENT_TYPES.join(',')}
          multiple
          hidden
          aria-label="Choose photos to add"
          onChange={(e) => {
            if (e.target.files?.length) void addFiles(e.target.files);
            e.target.value = '';
          }}
        />
      </div>

      {notes.length > 0 ? (
        <ul className="flex flex-col gap-1 text-micro">
          {notes.map((n) => (
            <li
              key={n.id}
              role={n.state === 'failed' ? 'alert' : undefined}
              className={n.state === 'failed' ? 'text-ember-700' : 'text-ink-muted'}
            >
              <span className="font-semibold">{n.name}</span>: {n.state === 'uploading' ? 'uploading…' : n.detail}
              {n.state === 'failed' ? (
                <button
                  type="button"
                  className="ml-2 underline"
                  onClick={() => setNotes((all) => all.filter((x) => x.id !== n.id))}
                >
                  Dismiss
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}

      {photos.isError ? (
        <p role="alert" className="text-caption text-danger">
          {photos.error.message}
        </p>
      ) : null}
      {reorder.isError ? (
        <p role="alert" className="text-caption text-danger">
          {reorder.error.message}
        </p>
      ) : null}

      <ol className="flex max-h-[28rem] flex-col gap-3 overflow-y-auto" aria-label="Photos in quote order">
        {list.map((photo, i) => (
          <PhotoItem
            key={photo.id}
            quoteId={quoteId}
            photo={photo}
            index={i}
            count={list.length}
            onMove={(d) => move(photo.id, d)}
          />
        ))}
      </ol>
      <p role="status" aria-live="polite" className="sr-only">
        {announce}
      </p>
    </section>
  );
}

function PhotoItem({
  quoteId,
  photo,
  index,
  count,
  onMove,
}: {
  quoteId: string;
  photo: QuotePhoto;
  index: number;
  count: number;
  onMove: (delta: -1 | 1) => void;
}) {
  const update = useUpdateQuotePhoto(quoteId);
  const remove = useDeleteQuotePhoto(quoteId);
  const [caption, setCaption] = useState(photo.caption);
  const captionId = useId();
  const name = photo.caption || `Photo ${index + 1}`;

  const saveCaption = () => {
    const next = caption.trim();
    if (next !== photo.caption) update.mutate({ photoId: photo.id, change: { caption: next, version: photo.version } });
  };
  const onKeyDown = (e: KeyboardEvent<HTMLLIElement>) => {
    if (e.altKey && (e.key === 'ArrowUp' || e.key === 'ArrowDown')) {
      e.preventDefault();
      onMove(e.key === 'ArrowUp' ? -1 : 1);
    }
  };

  return (
    <li onKeyDown={onKeyDown} className="flex flex-col gap-2 rounded-control p-2 ring-1 ring-line" data-testid="quote-photo">
      <a
        href={photo.imageUrl}
        target="_blank"
        rel="noreferrer"
        className="block overflow-hidden rounded-control bg-mist-100 focus-visible:outline-2 focus-visible:outline-lamp-400"
      >
        <img
          src={photo.thumbnailUrl}
          alt={name}
          loading="lazy"
          className={`aspect-[4/3] w-full object-cover ${photo.onQuote ? '' : 'opacity-60'}`}
        />
      </a>
      <label htmlFor={captionId} className="sr-only">
        Caption for {name}
      </label>
      <input
        id={captionId}
        value={caption}
        maxLength={300}
        placeholder="Add a caption"
        onChange={(e) => setCaption(e.target.value)}
        onBlur={saveCaption}
        onKeyDown={(e) => {
          if (e.key === 'Enter') {
            e.preventDefault();
            saveCaption();
          }
          if (e.key === 'Escape') setCaption(photo.caption);
        }}
        className="h-8 rounded-control bg-surface px-2 text-caption text-ink ring-1 ring-mist-300 focus:ring-2 focus:ring-lamp-400 focus:outline-none"
      />
      <div className="flex items-center justify-between gap-2">
        <label className="flex items-center gap-2 text-caption text-ink">
          <input
            type="checkbox"
            checked={photo.onQuote}
            onChange={(e) => update.mutate({ photoId: photo.id, change: { onQuote: e.target.checked, version: photo.version } })}
            className="size-4 accent-dusk-700"
          />
          On the quote
        </label>
        <div className="flex items-center gap-1">
          <IconButton label={`Move ${name} earlier`} disabled={index === 0} onClick={() => onMove(-1)} keyshortcuts="Alt+ArrowUp">
            ↑
          </IconButton>
          <IconButton
            label={`Move ${name} later`}
            disabled={index === count - 1}
            onClick={() => onMove(1)}
            keyshortcuts="Alt+ArrowDown"
          >
            ↓
          </IconButton>
          <IconButton
            label={`Remove ${name}`}
            disabled={remove.isPending}
            onClick={() => {
              if (window.confirm(`Remove ${name} from this quote?`)) remove.mutate(photo.id);
            }}
          >
            ×
          </IconButton>
        </div>
      </div>
      {update.isError ? (
        <p role="alert" className="text-micro text-danger">
          {update.error.message}
        </p>
      ) : null}
    </li>
  );
}

function IconButton({
  label,
  children,
  keyshortcuts,
  ...rest
}: {
  label: string;
  children: string;
  keyshortcuts?: string;
  disabled?: boolean;
  onClick: () => void;
}) {
  return (
    <button
      type="button"
      aria-label={label}
      title={label}
      aria-keyshortcuts={keyshortcuts}
      className="grid size-7 place-items-center rounded-control text-body text-dusk-700 hover:bg-dusk-50 focus-visible:outline-2 focus-visible:outline-lamp-400 disabled:text-mist-400"
      {...rest}
    >
      <span aria-hidden="true">{children}</span>
    </button>
  );
}
