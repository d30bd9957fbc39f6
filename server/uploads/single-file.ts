import type { RequestHandler } from 'express';
import multer from 'multer';
import { DomainError } from '../errors/domain-error';

export interface SingleFileOptions {
  /** Largest file accepted, in bytes. */
  maxBytes: number;
  /** How the limit reads in a sentence, e.g. "256 kB". */
  maxLabel: string;
  /** A first, cheap check of the declared type; the content is checked again by the route. */
  acceptType?: (mimetype: string, originalName: string) => boolean;
  /** The sentence for a file of the wrong type. */
  typeMessage?: string;
}

/**
 * One multipart file in the field `file`, kept in memory (never written to a temporary
 * folder), with the limits turned into the API's errors: 413 for size, 415 for type, 400 for
 * anything else about the form.
 */
export function singleFileUpload({ maxBytes, maxLabel, acceptType, typeMessage }: SingleFileOptions): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    // Browsers send file names as raw UTF-8 in the part header.
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 10, parts: 12, fieldSize: 10_000 },
    fileFilter: (_req, file, callback) => {
      if (file.fieldname !== 'file') return callback(new DomainError('invalid', 'invalid_upload', 'Send the file in the form field "file".', { file: 'Send the file in this field.' }));
      if (acceptType && !acceptType(file.mimetype.toLowerCase(), file.originalname)) {
        return callback(new DomainError('unsupported-type', 'unsupported_file_type', typeMessage ?? 'This type of file is not accepted here.', { file: typeMessage ?? 'Wrong type of file.' }));
      }
      callback(null, true);
    },
  }).single('file');

  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      next(new DomainError('unsupported-type', 'multipart_required', 'Send the file as multipart/form-data in the field "file".', { file: 'Choose a file to upload.' }));
      return;
    }
    upload(req, res, (error: unknown) => {
      if (!error) {
        if (!req.file) {
          next(new DomainError('invalid', 'file_missing', 'Choose a file to upload.', { file: 'Choose a file to upload.' }));
          return;
        }
        next();
        return;
      }
      if (error instanceof DomainError) return next(error);
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return next(new DomainError('too-large', 'file_too_large', `The file is larger than ${maxLabel}, the most this upload accepts.`, { file: `At most ${maxLabel}.` }));
        }
        if (error.code === 'LIMIT_UNEXPECTED_FILE' || error.code === 'LIMIT_FILE_COUNT') {
          return next(new DomainError('invalid', 'invalid_upload', 'Send exactly one file, in the form field "file".', { file: 'Send exactly one file here.' }));
        }
        return next(new DomainError('invalid', 'invalid_upload', 'The upload form is not as expected. Send one file in the field "file".'));
      }
      // Malformed multipart bodies come from busboy as plain errors.
      next(new DomainError('invalid', 'invalid_upload', 'The upload could not be read. Try again, or choose the file once more.'));
    });
  };
}
