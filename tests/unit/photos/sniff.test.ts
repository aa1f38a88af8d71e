import { describe, expect, it } from 'vitest';
import { SNIFF_LENGTH, sniffImageType } from '../../../src/lib/photos/sniff';

const bytes = (...parts: (number[] | string)[]) =>
  new Uint8Array(parts.flatMap((part) => (typeof part === 'string' ? [...Buffer.from(part, 'latin1')] : part)));

const JPEG_JFIF = bytes([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10], 'JFIF\0');
const JPEG_EXIF = bytes([0xff, 0xd8, 0xff, 0xe1, 0x12, 0x34], 'Exif\0\0');
const PNG = bytes([0x89], 'PNG\r\n\x1a\n', [0, 0, 0, 13], 'IHDR');
const WEBP = bytes('RIFF', [0x24, 0x00, 0x00, 0x00], 'WEBPVP8 ');

describe('sniffing the image type from the first bytes', () => {
  it('recognises a JPEG by its SOI marker, whatever segment follows', () => {
    expect(sniffImageType(JPEG_JFIF)).toBe('image/jpeg');
    expect(sniffImageType(JPEG_EXIF)).toBe('image/jpeg');
  });

  it('recognises a PNG by its eight-byte signature', () => {
    expect(sniffImageType(PNG)).toBe('image/png');
  });

  it('recognises a WebP as a RIFF container of form type WEBP', () => {
    expect(sniffImageType(WEBP)).toBe('image/webp');
  });

  it('needs no more than SNIFF_LENGTH bytes', () => {
    for (const image of [JPEG_JFIF, PNG, WEBP]) expect(sniffImageType(image.subarray(0, SNIFF_LENGTH))).not.toBeNull();
  });

  it('refuses text, even text that starts like a name ending in .jpg', () => {
    expect(sniffImageType(bytes('photo.jpg is what I called this file'))).toBeNull();
    expect(sniffImageType(bytes('<svg xmlns="http://www.w3.org/2000/svg"/>'))).toBeNull();
  });

  it('refuses the formats Lashline does not take: GIF, HEIC, TIFF, BMP', () => {
    expect(sniffImageType(bytes('GIF89a', [1, 0, 1, 0]))).toBeNull();
    expect(sniffImageType(bytes([0, 0, 0, 0x18], 'ftypheic'))).toBeNull();
    expect(sniffImageType(bytes('II*\0', [8, 0, 0, 0]))).toBeNull();
    expect(sniffImageType(bytes('BM', [0, 0, 0, 0, 0, 0, 0, 0]))).toBeNull();
  });

  it('refuses a RIFF container that is not WebP (a WAV file)', () => {
    expect(sniffImageType(bytes('RIFF', [0x24, 0, 0, 0], 'WAVEfmt '))).toBeNull();
  });

  it('refuses a signature that is cut short or one byte off', () => {
    expect(sniffImageType(new Uint8Array())).toBeNull();
    expect(sniffImageType(bytes([0xff, 0xd8]))).toBeNull();
    expect(sniffImageType(PNG.subarray(0, 7))).toBeNull();
    expect(sniffImageType(WEBP.subarray(0, 11))).toBeNull();
    expect(sniffImageType(bytes([0x89], 'PNG\r\n\x1a\x0b'))).toBeNull();
    expect(sniffImageType(bytes([0xff, 0xd9, 0xff, 0xe0]))).toBeNull();
  });

  it('does not look past the signature: the magic need only be at the very start', () => {
    expect(sniffImageType(bytes(' ', [0xff, 0xd8, 0xff, 0xe0]))).toBeNull();
  });
});
