/**
 * One uploaded file in memory (multer). The size limit stops reading at the limit, before anything parses the
 * file; multer's own errors become our error body.
 */
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from './http-error';

export function singleUpload(field: string, maxBytes: number, what: string): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 8, fieldSize: 4096 },
  }).single(field);
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file)
          return next(
            new HttpError(400, 'VALIDATION_FAILED', `Choose ${what} to upload.`, {
              [field]: ['No file was sent'],
            }),
          );
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return next(
            new HttpError(
              413,
              'PAYLOAD_TOO_LARGE',
              `${what[0].toUpperCase()}${what.slice(1)} may be at most ${Math.floor(maxBytes / 1024)} kB.`,
            ),
          );
        return next(
          new HttpError(400, 'VALIDATION_FAILED', `The upload was not understood: ${err.message}.`, {
            [err.field ?? field]: [err.message],
          }),
        );
      }
      next(err);
    });
  };
}
