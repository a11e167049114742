// Photos from the field: one image per upload (JPEG, PNG or WebP, at most 8 MB), kept in
// the database with the placement. The type is checked from the file's first bytes, not
// only from what the browser says.
import { singleFileUpload } from '../../middleware/upload.js';
import { badRequest } from '../../errors/http-errors.js';

export const maxPhotoBytes = 8 * 1024 * 1024;
const allowedTypes = ['image/jpeg', 'image/png', 'image/webp'];

export const photoUpload = singleFileUpload('photo', {
  maxBytes: maxPhotoBytes,
  fileFilter: (_req, file, done) => {
    if (allowedTypes.includes(file.mimetype)) return done(null, true);
    done(badRequest('A photo must be a JPEG, PNG or WebP image.', { photo: 'must be a JPEG, PNG or WebP image' }));
  },
});

/** The image type the bytes really are, or null. */
export function sniffImageType(data: Buffer): string | null {
  if (data.length > 3 && data[0] === 0xff && data[1] === 0xd8 && data[2] === 0xff) return 'image/jpeg';
  if (data.length > 8 && data.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'image/png';
  if (data.length > 12 && data.subarray(0, 4).toString('ascii') === 'RIFF' && data.subarray(8, 12).toString('ascii') === 'WEBP') return 'image/webp';
  return null;
}
