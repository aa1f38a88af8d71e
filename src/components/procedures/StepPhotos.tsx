import { useState } from 'react';
import type { StepPhotoView } from '../../lib/procedures/views';

interface Props {
  uploadUrl: string;
  stepNumber: string;
  initial: StepPhotoView[];
  canAdd: boolean;
}

/** A step's photos, and a camera button that sends one (re-encoded on the server, like inspection photos). */
export function StepPhotos({ uploadUrl, stepNumber, initial, canAdd }: Props) {
  const [photos, setPhotos] = useState(initial);
  const [message, setMessage] = useState<string | null>(null);
  const upload = async (file: File) => {
    setMessage('Sending the photo…');
    const form = new FormData();
    form.set('file', file);
    try {
      const response = await fetch(uploadUrl, { method: 'POST', body: form });
      const body = (await response.json()) as StepPhotoView & { error?: { message: string } };
      if (!response.ok) return setMessage(body.error?.message ?? `Not sent (${response.status}).`);
      setPhotos((current) => [...current, body]);
      setMessage(null);
    } catch {
      setMessage('A photo needs a connection; take it again when online.');
    }
  };
  if (!canAdd && photos.length === 0) return null;
  return (
    <div className="mb-2 flex flex-wrap items-center gap-2">
      {photos.map((photo) => (
        <a key={photo.id} href={photo.url}>
          <img
            src={photo.thumbnailUrl}
            alt={`Step ${stepNumber}, as shot at this rebuild`}
            className="h-20 w-auto border border-rule"
          />
        </a>
      ))}
      {canAdd && (
        <label className="btn btn-quiet min-h-14 cursor-pointer">
          Add a photo
          <input
            type="file"
            accept="image/jpeg,image/png,image/webp"
            capture="environment"
            className="sr-only"
            onChange={(event) => {
              const file = event.target.files?.[0];
              if (file) void upload(file);
              event.target.value = '';
            }}
          />
        </label>
      )}
      {message && <p role="status">{message}</p>}
    </div>
  );
}
