import { BROWSER_JPEG_QUALITY, fitWithin } from '../../lib/photos/reduce-size';

/**
 * A photo made smaller before it travels over the track's connection: turned upright from its EXIF
 * orientation, drawn at most 2,560 px on its long side on a white ground, and encoded as JPEG. The server
 * still decodes, re-encodes and strips every photo; this only saves the upload. Any trouble (an old browser,
 * a file the browser cannot decode) sends the file as it is, and so does a result that is not smaller.
 */
export async function reducePhoto(file: File): Promise<File> {
  if (typeof createImageBitmap !== 'function' || typeof document === 'undefined') return file;
  try {
    const bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
    const size = fitWithin(bitmap.width, bitmap.height);
    const canvas = document.createElement('canvas');
    canvas.width = size.width;
    canvas.height = size.height;
    const context = canvas.getContext('2d');
    if (!context) return file;
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, size.width, size.height);
    context.drawImage(bitmap, 0, 0, size.width, size.height);
    bitmap.close();
    const blob = await new Promise<Blob | null>((resolve) =>
      canvas.toBlob(resolve, 'image/jpeg', BROWSER_JPEG_QUALITY),
    );
    if (!blob || blob.size >= file.size) return file;
    return new File([blob], `${file.name.replace(/\.[^.]*$/, '') || 'photo'}.jpg`, { type: 'image/jpeg' });
  } catch {
    return file;
  }
}
