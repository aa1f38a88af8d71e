import { z } from 'zod';

/**
 * What an uploaded photo of a contact pattern must be, shared by the upload form and the server.
 * The sizes are the stored ones: every photo is re-encoded, so what the camera sent is never kept.
 */

export const PHOTO_SIDES = ['drive', 'coast'] as const;
export type PhotoSide = (typeof PHOTO_SIDES)[number];

/** The largest file accepted: a 12–50 MP phone JPEG is 3–12 MB. */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

/** Room for the multipart boundaries, headers and the `side` field around the file. */
export const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

/** Decoding more than this would need hundreds of megabytes; a real camera stays below it. */
export const MAX_INPUT_PIXELS = 50_000_000;

/** The longest side of the stored photo and of its thumbnail, in pixels. */
export const FULL_LONGEST_SIDE = 2560;
export const THUMBNAIL_LONGEST_SIDE = 320;

/** The fields of an upload beside the file itself. */
export const photoFieldsSchema = z.object({ side: z.enum(PHOTO_SIDES, { error: 'Choose drive or coast.' }) });

/**
 * The file name a photo is served under; the uploaded name is never kept.
 * @example photoIdToFileName('3f2a…', 'thumbnail') // 'lashline-photo-3f2a…-thumbnail.jpg'
 */
export function photoIdToFileName(id: string, variant: 'full' | 'thumbnail' = 'full'): string {
  return `lashline-photo-${id}${variant === 'thumbnail' ? '-thumbnail' : ''}.jpg`;
}
