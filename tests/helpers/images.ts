import { createDeflate, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import type { ApiClient } from './api-client';

/**
 * Real image bytes for the photo tests, made with sharp, and the small readers the tests use to
 * look inside them.
 */

export const CAMERA_MAKE = 'LashlineTestCam';
const XMP = `<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description xmlns:exif="http://ns.adobe.com/exif/1.0/" exif:GPSLatitude="30,0.0N" exif:GPSLongitude="40,0.0W"/></rdf:RDF></x:xmpmeta>`;

/**
 * A 400×300 JPEG as the sensor stored it — left half red, right half blue — carrying EXIF
 * Orientation 6 (turn 90° clockwise to view), a camera Make, a GPS position, XMP and a Display P3
 * ICC profile: everything the server must strip.
 */
export function cameraJpeg(): Promise<Buffer> {
  const halves = Buffer.alloc(400 * 300 * 3);
  for (let y = 0; y < 300; y += 1) {
    for (let x = 0; x < 400; x += 1) halves.set(x < 200 ? [220, 20, 20] : [20, 20, 220], (y * 400 + x) * 3);
  }
  return sharp(halves, { raw: { width: 400, height: 300, channels: 3 } })
    .withIccProfile('p3')
    .withMetadata({ orientation: 6 })
    .withExifMerge({
      IFD0: { Make: CAMERA_MAKE, Model: 'Pit Camera 9' },
      IFD3: {
        GPSLatitudeRef: 'N',
        GPSLatitude: '30/1 0/1 0/1',
        GPSLongitudeRef: 'W',
        GPSLongitude: '40/1 0/1 0/1',
      },
    })
    .withXmp(XMP)
    .jpeg({ quality: 90 })
    .toBuffer();
}

/** A grey-noise photo (noise so that its scan data is large and a cut really cuts pixels). */
export function noiseImage(format: 'jpeg' | 'png' | 'webp', width = 800, height = 600): Promise<Buffer> {
  return sharp({
    create: { width, height, channels: 3, background: 'black', noise: { type: 'gaussian', mean: 128, sigma: 40 } },
  })
    .toFormat(format)
    .toBuffer();
}

/** A large PNG with a transparent left half and an opaque green right half (compresses to little). */
export function largeTransparentPng(width = 4000, height = 3000): Promise<Buffer> {
  return sharp({ create: { width: width / 2, height, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } })
    .extend({ right: width / 2, background: { r: 0, g: 160, b: 0, alpha: 1 } })
    .png()
    .toBuffer();
}

function crc32(bytes: Buffer): number {
  let crc = 0xffffffff;
  for (const byte of bytes) {
    crc ^= byte;
    for (let k = 0; k < 8; k += 1) crc = crc & 1 ? 0xedb88320 ^ (crc >>> 1) : crc >>> 1;
  }
  return (crc ^ 0xffffffff) >>> 0;
}

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/**
 * A complete, valid greyscale PNG of `side`×`side` black pixels: 30000² is 900 megapixels (900 MB
 * decoded) in about 4 MB, because rows of zeros deflate to almost nothing. An image bomb.
 */
export async function pngBomb(side = 30_000): Promise<Buffer> {
  const deflate = createDeflate({ level: 1 });
  const compressed: Buffer[] = [];
  deflate.on('data', (chunk: Buffer) => compressed.push(chunk));
  const ended = new Promise((resolve) => deflate.on('end', resolve));
  const ROWS_PER_WRITE = 500;
  for (let y = 0; y < side; y += ROWS_PER_WRITE) {
    // Each row is a filter byte (0, none) and `side` grey samples, all zero.
    const rows = Buffer.alloc((side + 1) * Math.min(ROWS_PER_WRITE, side - y));
    if (!deflate.write(rows)) await new Promise((resolve) => deflate.once('drain', resolve));
  }
  deflate.end();
  await ended;
  return Buffer.concat([
    PNG_SIGNATURE,
    pngChunk('IHDR', pngHeader(side, 0)),
    pngChunk('IDAT', Buffer.concat(compressed)),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Under 100 bytes: a PNG header declaring `side`×`side` RGB pixels with almost no data behind it. */
export function pngHeaderBomb(side = 30_000): Buffer {
  return Buffer.concat([
    PNG_SIGNATURE,
    pngChunk('IHDR', pngHeader(side, 2)),
    pngChunk('IDAT', deflateSync(Buffer.alloc(1024))),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** IHDR: width, height, bit depth 8, colour type (0 grey, 2 RGB), deflate, adaptive filters, no interlace. */
function pngHeader(side: number, colourType: 0 | 2): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(side, 0);
  header.writeUInt32BE(side, 4);
  header[8] = 8;
  header[9] = colourType;
  return header;
}

/**
 * The tags of IFD0 and of the GPS IFD in an EXIF block as sharp returns it ("Exif\0\0" + TIFF),
 * read by hand so the test does not trust the library it is checking.
 */
export function readExifTags(exif: Buffer): { ifd0: number[]; gps: number[] } {
  const tiff = exif.subarray(exif.indexOf('Exif\0\0', 0, 'latin1') + 6);
  const little = tiff.toString('latin1', 0, 2) === 'II';
  const u16 = (at: number) => (little ? tiff.readUInt16LE(at) : tiff.readUInt16BE(at));
  const u32 = (at: number) => (little ? tiff.readUInt32LE(at) : tiff.readUInt32BE(at));
  const entries = (offset: number) =>
    Array.from({ length: u16(offset) }, (_, i) => ({
      tag: u16(offset + 2 + i * 12),
      value: u32(offset + 2 + i * 12 + 8),
    }));
  const ifd0 = entries(u32(4));
  const gpsPointer = ifd0.find((entry) => entry.tag === 0x8825);
  return { ifd0: ifd0.map((e) => e.tag), gps: gpsPointer ? entries(gpsPointer.value).map((e) => e.tag) : [] };
}

/** The GPS tags this test writes: GPSLatitudeRef, GPSLatitude, GPSLongitudeRef, GPSLongitude. */
export const GPS_TAGS = [1, 2, 3, 4];

/** Byte patterns that only metadata carries: an EXIF block, the camera Make, XMP, an ICC profile. */
export const METADATA_MARKERS = ['Exif\0\0', CAMERA_MAKE, 'http://ns.adobe.com', 'acsp'];

/** Uploads `bytes` as the multipart field `file` with `side`, the way a browser form does. */
export async function uploadPhoto(
  client: ApiClient,
  inspectionId: string,
  bytes: Uint8Array | null,
  options: { side?: string | null; filename?: string; type?: string } = {},
): Promise<{ status: number; body: any; headers: Headers }> {
  const form = new FormData();
  if (bytes)
    form.set(
      'file',
      new Blob([new Uint8Array(bytes)], { type: options.type ?? 'image/jpeg' }),
      options.filename ?? 'pattern.jpg',
    );
  if (options.side !== null) form.set('side', options.side ?? 'drive');
  const response = await client.request(`/api/inspections/${inspectionId}/photos`, { method: 'POST', body: form });
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null, headers: response.headers };
}

/** Fetches one photo's bytes (full or thumbnail) with its response. */
export async function fetchPhoto(client: ApiClient, url: string): Promise<{ response: Response; bytes: Buffer }> {
  const response = await client.request(url);
  return { response, bytes: Buffer.from(await response.arrayBuffer()) };
}
