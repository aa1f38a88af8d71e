import sharp, { type JpegOptions, type Metadata, type Sharp } from 'sharp';
import { SHARP_FORMAT, sniffImageType } from '../photos/sniff';
import { FULL_LONGEST_SIDE, MAX_INPUT_PIXELS, THUMBNAIL_LONGEST_SIDE } from '../photos/upload-rules';
import { HttpError } from './http';

/**
 * Turns an uploaded file into the two JPEGs Lashline stores. Every photo is decoded to the last
 * pixel and encoded again, so what is stored holds only pixels: no EXIF (GPS, camera serial), no
 * XMP, no IPTC, no ICC profile (colours are converted to sRGB first), nothing a crafted file could
 * smuggle through.
 */

export interface EncodedImage {
  bytes: Uint8Array;
  width: number;
  height: number;
  contentType: 'image/jpeg';
}

export interface EncodedPhoto {
  full: EncodedImage;
  thumbnail: EncodedImage;
}

// 'error' stops at a truncated file or a corrupt segment; 'warning' would also refuse camera
// JPEGs with harmless quirks (extraneous bytes before a marker), which phones do produce.
const INPUT_OPTIONS = { failOn: 'error', limitInputPixels: MAX_INPUT_PIXELS } as const;
const WORK_TIMEOUT_SECONDS = 30;
// At most this many images decode at once: each may hold ~150 MB of pixels at the pixel limit.
const MAX_CONCURRENT = 2;

let running = 0;
const waiting: (() => void)[] = [];

async function withImageSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= MAX_CONCURRENT) await new Promise<void>((resolve) => waiting.push(resolve));
  running += 1;
  try {
    return await work();
  } finally {
    running -= 1;
    waiting.shift()?.();
  }
}

const notImage = () =>
  new HttpError(415, 'file: send a JPEG, PNG or WebP photo (the file’s content is none of these, whatever its name).', {
    file: 'not a JPEG, PNG or WebP image',
  });
const unreadable = (why: string) => new HttpError(422, `file: ${why}`, { file: why });

/**
 * Checks the file's content and re-encodes it: 415 when it is not JPEG/PNG/WebP, 422 when it is
 * truncated, corrupt or larger than 50 megapixels (checked from the header, before any decoding).
 */
export async function encodePhoto(input: Uint8Array): Promise<EncodedPhoto> {
  const type = sniffImageType(input);
  if (!type) throw notImage();
  return withImageSlot(async () => {
    let header: Metadata;
    try {
      header = await sharp(input, INPUT_OPTIONS).metadata();
    } catch (error) {
      if (/pixel limit/i.test(String(error))) throw tooManyPixels();
      throw unreadable('the image is corrupt or not a complete image; take or export it again.');
    }
    if (header.format !== SHARP_FORMAT[type])
      throw unreadable('the image is corrupt: its header and its content disagree.');
    if ((header.width ?? 0) * (header.height ?? 0) > MAX_INPUT_PIXELS) throw tooManyPixels();
    const full = await reencode(input);
    const thumbnail = await toJpeg(
      sharp(full.bytes).resize(THUMBNAIL_LONGEST_SIDE, THUMBNAIL_LONGEST_SIDE, {
        fit: 'inside',
        withoutEnlargement: true,
      }),
      { quality: 76, mozjpeg: true },
    );
    return { full, thumbnail };
  });
}

const tooManyPixels = () =>
  unreadable(`the image is larger than ${MAX_INPUT_PIXELS / 1_000_000} megapixels; send a smaller one.`);

async function reencode(input: Uint8Array): Promise<EncodedImage> {
  try {
    const pipeline = sharp(input, INPUT_OPTIONS)
      .timeout({ seconds: WORK_TIMEOUT_SECONDS })
      // Turns the pixels the way the camera's Orientation tag says, then drops the tag.
      .rotate()
      .resize(FULL_LONGEST_SIDE, FULL_LONGEST_SIDE, { fit: 'inside', withoutEnlargement: true })
      // JPEG has no transparency: a PNG or WebP with alpha goes onto white.
      .flatten({ background: '#ffffff' });
    // 4:4:4 keeps the colour edges of the marking compound that 4:2:0 would blur.
    return await toJpeg(pipeline, { quality: 85, mozjpeg: true, chromaSubsampling: '4:4:4' });
  } catch (error) {
    if (error instanceof HttpError) throw error;
    throw unreadable('the image is truncated or corrupt; take or export it again.');
  }
}

async function toJpeg(pipeline: Sharp, options: JpegOptions): Promise<EncodedImage> {
  // No withMetadata()/keepExif()/keepIccProfile(): sharp writes none of the input's metadata.
  const { data, info } = await pipeline.jpeg(options).toBuffer({ resolveWithObject: true });
  return {
    bytes: new Uint8Array(data.buffer, data.byteOffset, data.byteLength),
    width: info.width,
    height: info.height,
    contentType: 'image/jpeg',
  };
}
