import { useEffect, useId, useRef, useState } from 'react';
import { inspectionApi, uploadPhoto, type PhotoView } from './inspection-api';
import { SheetSection } from './fields';
import { browserPhotoQueue, type PhotoQueue } from './photo-queue';
import { reducePhoto } from './reduce-photo';
import { newUuid } from './sheet-boot';

/**
 * Photos of the pattern, several per side. Each is made smaller on the device (2,560 px, JPEG, upright),
 * kept there with the draft at once, and sent when the draft is on Lashline and there is a connection, so a
 * photo taken offline, or before the draft reached the server, is never lost (decision 004).
 */
interface Upload {
  key: string;
  file: File;
  side: 'drive' | 'coast';
  progress: number;
  state: 'waiting' | 'uploading' | 'failed';
  message?: string;
  /** A lost connection or a server fault is worth another try; a refused file is not. */
  retryable?: boolean;
}

export function PhotosSection({
  draftId,
  inspectionId,
  online,
  canChange,
  queue: givenQueue,
}: {
  /** The draft's local id: photos wait on the device under it. */
  draftId: string;
  inspectionId: string | null;
  online: boolean;
  canChange: boolean;
  queue?: PhotoQueue;
}) {
  const [queue] = useState(() => givenQueue ?? browserPhotoQueue());
  const [photos, setPhotos] = useState<PhotoView[]>([]);
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [problem, setProblem] = useState('');
  const sending = useRef(new Set<string>());

  useEffect(() => {
    if (!inspectionId || !online) return;
    let live = true;
    void inspectionApi.photos(inspectionId).then((answer) => {
      if (live && answer.ok) setPhotos(answer.data.items);
    });
    return () => {
      live = false;
    };
  }, [inspectionId, online]);

  // What waited on this device from an earlier visit comes back into the list.
  useEffect(() => {
    let live = true;
    void queue.list(draftId).then((waiting) => {
      if (!live) return;
      setUploads((list) => [
        ...list,
        ...waiting
          .filter((w) => !list.some((u) => u.key === w.key))
          .map((w) => ({ key: w.key, file: w.file, side: w.side, progress: 0, state: 'waiting' as const })),
      ]);
    });
    return () => {
      live = false;
    };
  }, [queue, draftId]);

  const start = (upload: Upload) => {
    if (!inspectionId || sending.current.has(upload.key)) return;
    sending.current.add(upload.key);
    setUploads((list) =>
      list.map((u) => (u.key === upload.key ? { ...u, state: 'uploading', progress: 0, message: undefined } : u)),
    );
    const job = uploadPhoto(inspectionId, upload.file, upload.side, (progress) =>
      setUploads((list) => list.map((u) => (u.key === upload.key ? { ...u, progress } : u))),
    );
    void job.done.then(async (answer) => {
      sending.current.delete(upload.key);
      if (answer.ok) {
        await queue.remove(upload.key);
        setPhotos((list) => [...list, answer.data]);
        setUploads((list) => list.filter((u) => u.key !== upload.key));
        return;
      }
      const lost = answer.problem.status === 0;
      const retryable = lost || answer.problem.status >= 500 || answer.problem.status === 429;
      setUploads((list) =>
        list.map((u) =>
          u.key !== upload.key
            ? u
            : lost
              ? // The connection went: it waits on the device and goes again when the connection is back.
                { ...u, state: 'waiting', progress: 0 }
              : { ...u, state: 'failed', message: answer.problem.message, retryable },
        ),
      );
    });
  };

  // Send what waits as soon as the draft is on Lashline and there is a connection.
  useEffect(() => {
    if (!inspectionId || !online) return;
    for (const upload of uploads) if (upload.state === 'waiting') start(upload);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- start reads the latest props itself
  }, [uploads, inspectionId, online]);

  const add = async (side: 'drive' | 'coast', files: FileList | null) => {
    for (const original of Array.from(files ?? [])) {
      const file = await reducePhoto(original);
      const waiting = { key: newUuid(), draftId, side, file, addedAt: Date.now() };
      try {
        await queue.put(waiting);
      } catch {
        setProblem(
          'This device could not keep the photo (its storage is full or blocked); it is sent while the page stays open.',
        );
      }
      setUploads((list) => [...list, { key: waiting.key, file, side, progress: 0, state: 'waiting' }]);
    }
  };

  const dismiss = (upload: Upload) => {
    void queue.remove(upload.key);
    setUploads((list) => list.filter((u) => u.key !== upload.key));
  };

  const remove = async (photo: PhotoView) => {
    if (!inspectionId) return;
    const answer = await inspectionApi.deletePhoto(inspectionId, photo.id);
    if (answer.ok) setPhotos((list) => list.filter((p) => p.id !== photo.id));
    else setProblem(answer.problem.message);
  };

  const why = !canChange
    ? 'You cannot add photos to this inspection.'
    : !inspectionId
      ? 'Photos taken now are kept on this device and sent once the draft is on Lashline: as soon as the gear set, the time and the runs are filled in and there is a connection.'
      : !online
        ? 'Offline: photos taken now are kept on this device and sent when the connection is back.'
        : '';

  return (
    <SheetSection id="photos" title="Pattern photos">
      {why && (
        <p className="notice mb-4" data-testid="photos-why">
          {why}
        </p>
      )}
      {problem && (
        <p className="notice notice-error mb-4" role="alert">
          {problem}
        </p>
      )}
      <div className="grid gap-6 md:grid-cols-2">
        {(['drive', 'coast'] as const).map((side) => (
          <PhotoSide
            key={side}
            side={side}
            photos={photos.filter((p) => p.side === side)}
            uploads={uploads.filter((u) => u.side === side)}
            enabled={canChange}
            canRemove={canChange && Boolean(inspectionId) && online}
            onAdd={(files) => void add(side, files)}
            onRetry={start}
            onDismiss={dismiss}
            onRemove={remove}
          />
        ))}
      </div>
    </SheetSection>
  );
}

function PhotoSide({
  side,
  photos,
  uploads,
  enabled,
  canRemove,
  onAdd,
  onRetry,
  onDismiss,
  onRemove,
}: {
  side: 'drive' | 'coast';
  photos: PhotoView[];
  uploads: Upload[];
  enabled: boolean;
  canRemove: boolean;
  onAdd: (files: FileList | null) => void;
  onRetry: (u: Upload) => void;
  onDismiss: (u: Upload) => void;
  onRemove: (p: PhotoView) => void;
}) {
  const id = useId();
  const title = side === 'drive' ? 'Drive side' : 'Coast side';
  return (
    <div data-testid={`photos-${side}`}>
      <h3 className="mb-2 font-bold">{title}</h3>
      {photos.length === 0 && uploads.length === 0 && <p className="mb-2 text-ink-soft">No photos yet.</p>}
      <ul className="mb-3 grid grid-cols-2 gap-3 sm:grid-cols-3">
        {photos.map((photo, i) => (
          <li key={photo.id} className="flex flex-col gap-1">
            <a href={photo.url} target="_blank" rel="noopener">
              <img
                src={photo.thumbnailUrl}
                alt={`${title} contact pattern, shot ${i + 1} (opens the full size)`}
                className="aspect-square w-full rounded-md border border-rule object-cover"
                loading="lazy"
                data-testid="photo-thumbnail"
              />
            </a>
            <button
              type="button"
              className="btn btn-quiet !min-h-10 !px-2 text-sm"
              onClick={() => onRemove(photo)}
              disabled={!canRemove}
              aria-label={`Remove ${title.toLowerCase()} photo ${i + 1}`}
            >
              Remove
            </button>
          </li>
        ))}
      </ul>
      {uploads.map((u) => (
        <div key={u.key} className="mb-3 rounded-md border border-rule p-2" data-testid="photo-upload">
          <p className="truncate text-sm font-semibold">{u.file.name}</p>
          {u.state === 'waiting' ? (
            <p className="text-sm text-ink-soft" data-testid="photo-waiting">
              Kept on this device; sent when the draft is on Lashline and there is a connection.
            </p>
          ) : u.state === 'uploading' ? (
            <>
              <progress className="progress-bar" max={1} value={u.progress} aria-label={`Uploading ${u.file.name}`} />
              <p className="text-sm text-ink-soft">{Math.round(u.progress * 100)} % sent</p>
            </>
          ) : (
            <div className="flex flex-wrap items-center gap-2">
              <p className="field-error text-sm" role="alert">
                <span aria-hidden="true">✕ </span>Not uploaded: {u.message}
              </p>
              {u.retryable ? (
                <button
                  type="button"
                  className="btn btn-quiet !min-h-10"
                  onClick={() => onRetry(u)}
                  disabled={!enabled}
                >
                  Retry
                </button>
              ) : (
                <button type="button" className="btn btn-quiet !min-h-10" onClick={() => onDismiss(u)}>
                  Dismiss
                </button>
              )}
            </div>
          )}
        </div>
      ))}
      <input
        id={id}
        type="file"
        accept="image/jpeg,image/png,image/webp"
        multiple
        className="peer sr-only"
        disabled={!enabled}
        onChange={(e) => {
          onAdd(e.target.files);
          e.target.value = '';
        }}
        onKeyDown={(e) => {
          // A file input opens its picker on Space only; Enter would otherwise move the sheet to its next field.
          if (e.key !== 'Enter') return;
          e.preventDefault();
          e.stopPropagation();
          e.currentTarget.click();
        }}
        data-testid={`photo-input-${side}`}
      />
      <label
        htmlFor={id}
        className={`btn btn-quiet peer-focus-visible:outline-[3px] peer-focus-visible:outline-offset-2 peer-focus-visible:outline-amber ${enabled ? '' : 'pointer-events-none opacity-50'}`}
      >
        Add {side} photos
      </label>
    </div>
  );
}
