import { describe, expect, it } from 'vitest';
import { MAX_PHOTO_BYTES, MULTIPART_OVERHEAD_BYTES } from '../../../src/lib/photos/upload-rules';
import { tooLargeBody } from '../../../src/lib/body-limits.mjs';
import { bodyLimitFor } from '../../../src/lib/server/body-limits';

const KB = 1024;
const MB = 1024 * KB;

describe('the table of body caps', () => {
  it.each([
    ['/api/auth/callback/credentials', 64 * KB],
    ['/sign-up', 64 * KB],
    ['/sign-in', 64 * KB],
    ['/account', 64 * KB],
    ['/api/analysis/backlash', 64 * KB],
    ['/api/cars', 1 * MB],
    ['/api/runs/import', 5 * MB],
    ['/api/inspections/abc/photos', MAX_PHOTO_BYTES + MULTIPART_OVERHEAD_BYTES],
    ['/api/imports/team', 64 * MB],
    ['/team/data', 64 * MB],
  ])('caps %s at %i bytes', (path, bytes) => {
    expect(bodyLimitFor(path)).toBe(bytes);
  });

  it('answers the photo route in its own words and the others with the cap', () => {
    expect(tooLargeBody('/api/inspections/abc/photos').error.fields).toEqual({ file: 'larger than 15 MB' });
    expect(tooLargeBody('/sign-up').error.message).toContain('64 KB');
    expect(tooLargeBody('/api/cars').error.message).toContain('1 MB');
  });
});
