import multer from 'multer';
import type { RequestHandler } from 'express';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_BUNDLE } from '@scrap-relay/shared';
import { badRequest, payloadTooLarge } from '../errors/index.ts';

/** Photos arrive in memory (15 MB each at most), so nothing half-written is left on disk when one is refused. */
export function photoUpload(field = 'photos'): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_PHOTO_BYTES, files: MAX_PHOTOS_PER_BUNDLE, fields: 5, parts: MAX_PHOTOS_PER_BUNDLE + 5 },
  }).array(field, MAX_PHOTOS_PER_BUNDLE);
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next(badRequest('Send the photos as multipart/form-data.', { [field]: 'Expected a multipart upload.' }));
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(payloadTooLarge(field));
        if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE' && err.field === field)
          return next(badRequest(`A bundle has at most ${MAX_PHOTOS_PER_BUNDLE} photos.`, { [field]: `At most ${MAX_PHOTOS_PER_BUNDLE} photos.` }));
        return next(badRequest(`The upload was refused: ${err.message}.`, { [err.field ?? field]: err.message }));
      }
      next(badRequest('The upload could not be read.', { [field]: 'Could not read the upload.' }));
    });
  };
}
