/**
 * How large a photo travels from the browser: its long side at most 2,560 px, the size the server keeps
 * anyway, so a 12-megapixel phone photo of 5 MB goes up as a JPEG of well under 1 MB.
 */
export const BROWSER_LONG_SIDE = 2560;
/** JPEG quality in the browser: the server re-encodes every photo, so this only has to keep the detail. */
export const BROWSER_JPEG_QUALITY = 0.85;

/**
 * The size a `width` × `height` image is drawn at so its long side is at most `longSide`, keeping its shape.
 * @example fitWithin(4032, 3024) // { width: 2560, height: 1920 }
 */
export function fitWithin(
  width: number,
  height: number,
  longSide = BROWSER_LONG_SIDE,
): { width: number; height: number } {
  const long = Math.max(width, height);
  if (long <= longSide) return { width, height };
  const scale = longSide / long;
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}
