import { useEffect, useId, useRef, useState } from 'react';
import { inspectionApi, uploadPhoto, type PhotoView } from './inspection-api';
import { SheetSection } from './fields';

/**
 * Photos of the pattern, several per side. They go straight to Lashline (no copy is kept in the
 * browser: a photo is megabytes), so they need the draft to exist on the server and a connection.
 */
interface Upload {
  key: number;
  file: File;
  side: 'drive' | 'coast';
  progress: number;
  state: 'uploading' | 'failed';
  message?: string;
  /** A lost connection or a server fault is worth another try; a refused file is not. */
  retryable?: boolean;
}

export function PhotosSection({
  inspectionId,
  online,
  canChange,
}: {
  inspectionId: string | null;
  online: boolean;
  canChange: boolean;
}) {
  const [photos, setPhotos] = useState<PhotoView[]>([]);
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [problem, setProblem] = useState('');
  const next = useRef(1);

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

  const start = (upload: Upload) => {
    if (!inspectionId) return;
    setUploads((list) => [
      ...list.filter((u) => u.key !== upload.key),
      { ...upload, state: 'uploading', progress: 0, message: undefined },
    ]);
    const job = uploadPhoto(inspectionId, upload.file, upload.side, (progress) =>
      setUploads((list) => list.map((u) => (u.key === upload.key ? { ...u, progress } : u))),
    );
    void job.done.then((answer) => {
      if (answer.ok) {
        setPhotos((list) => [...list, answer.data]);
        setUploads((list) => list.filter((u) => u.key !== upload.key));
      } else {
        const retryable = answer.problem.status === 0 || answer.problem.status >= 500 || answer.problem.status === 429;
        setUploads((list) =>
          list.map((u) =>
            u.key === upload.key ? { ...u, state: 'failed', message: answer.problem.message, retryable } : u,
          ),
        );
      }
    });
  };

  const add = (side: 'drive' | 'coast', files: FileList | null) => {
    for (const file of Array.from(files ?? []))
      start({ key: next.current++, file, side, progress: 0, state: 'uploading' });
  };

  const remove = async (photo: PhotoView) => {
    if (!inspectionId) return;
    const answer = await inspectionApi.deletePhoto(inspectionId, photo.id);
    if (answer.ok) setPhotos((list) => list.filter((p) => p.id !== photo.id));
    else setProblem(answer.problem.message);
  };

  const why = !inspectionId
    ? 'Photos can be added once the draft is on Lashline: it is sent as soon as the gear set, the time and the runs are filled in and there is a connection.'
    : !online
      ? 'Offline: photos go straight to Lashline, so add them when the connection is back. Everything typed is kept on this device meanwhile.'
      : !canChange
        ? 'You cannot add photos to this inspection.'
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
            enabled={!why}
            onAdd={(files) => add(side, files)}
            onRetry={start}
            onDismiss={(u) => setUploads((list) => list.filter((x) => x.key !== u.key))}
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
  onAdd,
  onRetry,
  onDismiss,
  onRemove,
}: {
  side: 'drive' | 'coast';
  photos: PhotoView[];
  uploads: Upload[];
  enabled: boolean;
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
              disabled={!enabled}
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
          {u.state === 'uploading' ? (
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
