import { webcrypto } from 'node:crypto';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import type { Database } from '../db/client';
import { uploads } from '../db/schema';
import { uploadLimitBytes, uploadTooLarge } from '../../shared/api/uploads';
import { withoutControlCharacters } from '../../shared/text/plain-text';
import { onlyBodiesOf } from './bodies';
import { HttpError } from './errors';

/**
 * One multipart file field (plus text fields), kept in memory up to the limit. A body of another type answers 415;
 * a multipart body that cannot be read (no boundary, cut short, a malformed part) answers 400 on the file field.
 * Control characters (NUL among them) are taken out of the file's name.
 */
export function singleUpload(field: string): RequestHandler[] {
  const read = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: uploadLimitBytes, files: 1, fields: 10, fieldSize: 1024 * 1024 },
  }).single(field);
  const readOrRefuse: RequestHandler = (req, res, next) =>
    read(req, res, (error?: unknown) => {
      if (!error || error instanceof multer.MulterError) {
        if (req.file) req.file.originalname = withoutControlCharacters(req.file.originalname);
        return next(error);
      }
      const why = (error as Error).message ?? 'it could not be read';
      next(
        new HttpError(
          400,
          'bad_upload',
          `${field}: the multipart body could not be read (${why}).`,
          field,
        ),
      );
    });
  return [
    onlyBodiesOf(
      'multipart/form-data',
      `a multipart/form-data body with the file in the field "${field}"`,
    ),
    readOrRefuse,
  ];
}

/** Multer's faults as the JSON error shape: the limit is said in the message. */
export const uploadErrors: ErrorRequestHandler = (error, _req, _res, next) => {
  if (!(error instanceof multer.MulterError)) return next(error);
  if (error.code === 'LIMIT_FILE_SIZE') {
    return next(new HttpError(413, 'too_large', uploadTooLarge, 'file'));
  }
  next(
    new HttpError(
      400,
      'bad_upload',
      `${error.field ?? 'upload'}: ${error.message}.`,
      error.field ?? 'file',
    ),
  );
};

export function requireFile(file: Express.Multer.File | undefined): Express.Multer.File {
  if (!file)
    throw new HttpError(
      400,
      'invalid',
      'file: is required: send the file as multipart form data in the field "file".',
      'file',
    );
  if (file.size === 0) throw new HttpError(400, 'invalid', 'file: is empty.', 'file');
  return file;
}

/** Keeps a signed-in user's upload in their history, with its checksum. */
export async function recordUpload(
  db: Database,
  userId: string | undefined,
  purpose: string,
  file: Express.Multer.File,
): Promise<string> {
  // Web Crypto hashes on the thread pool, so a 5 MB upload does not hold the event loop while it is hashed.
  const digest = await webcrypto.subtle.digest('SHA-256', file.buffer as Uint8Array<ArrayBuffer>);
  const sha256 = Buffer.from(digest).toString('hex');
  if (userId) {
    await db.insert(uploads).values({
      userId,
      purpose,
      fileName: file.originalname.slice(0, 200),
      byteSize: file.size,
      sha256,
    });
  }
  return sha256;
}
