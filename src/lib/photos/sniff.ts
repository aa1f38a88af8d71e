/**
 * Which image format a file is, read from its first bytes — never from its name or the type the
 * browser claimed. Only the three formats Lashline accepts are recognised.
 */

export const IMAGE_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export type ImageType = (typeof IMAGE_TYPES)[number];

/** The bytes needed to tell the three formats apart (WebP's "RIFF....WEBP" is the longest). */
export const SNIFF_LENGTH = 12;

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const ASCII_RIFF = [0x52, 0x49, 0x46, 0x46];
const ASCII_WEBP = [0x57, 0x45, 0x42, 0x50];

function startsWith(bytes: Uint8Array, expected: readonly number[], offset = 0): boolean {
  if (bytes.length < offset + expected.length) return false;
  return expected.every((byte, i) => bytes[offset + i] === byte);
}

/**
 * The image type the magic bytes announce, or null for anything else (text, GIF, HEIC, a WAV file
 * in a RIFF container, too few bytes). It says what the file claims to be; decoding proves it.
 * @example sniffImageType(new Uint8Array([0xff, 0xd8, 0xff, 0xe0])) // 'image/jpeg'
 */
export function sniffImageType(bytes: Uint8Array): ImageType | null {
  // JPEG: SOI (FF D8) followed by the first marker's FF.
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return 'image/jpeg';
  if (startsWith(bytes, PNG_SIGNATURE)) return 'image/png';
  // WebP: a RIFF container (4-byte little-endian size in between) whose form type is WEBP.
  if (startsWith(bytes, ASCII_RIFF) && startsWith(bytes, ASCII_WEBP, 8)) return 'image/webp';
  return null;
}

/** The name sharp gives each accepted format in `metadata().format`. */
export const SHARP_FORMAT: Record<ImageType, string> = {
  'image/jpeg': 'jpeg',
  'image/png': 'png',
  'image/webp': 'webp',
};
