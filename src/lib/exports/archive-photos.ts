/** Bytes a photo adds to an archive: its base64 text and the `"image":"…",` around it. */
export function photoArchiveBytes(bytes: number): number {
  return 4 * Math.ceil(bytes / 3) + 12;
}

/**
 * Which photos travel inside an archive of at most `limit` bytes, oldest first: each one while it still
 * fits after `baseBytes` (the document without photo bytes) and the photos taken before it.
 * @example choosePhotosWithin(1000, [300, 600, 100], 1600) // [true, false, true]
 */
export function choosePhotosWithin(baseBytes: number, photoBytes: readonly number[], limit: number): boolean[] {
  let size = baseBytes;
  return photoBytes.map((bytes) => {
    const added = photoArchiveBytes(bytes);
    if (size + added > limit) return false;
    size += added;
    return true;
  });
}
