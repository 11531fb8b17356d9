import type { RequestHandler } from 'express';
import multer from 'multer';
import { badRequest, HttpError } from '../errors';

export interface UploadRule {
  /** The multipart field that carries the file. */
  field: string;
  maxBytes: number;
  /** How the messages name the file, e.g. "logger file". */
  what: string;
}

function megabytes(bytes: number): string {
  const value = bytes / (1024 * 1024);
  return Number.isInteger(value) ? String(value) : value.toFixed(1);
}

/**
 * One file from a multipart form, held in memory up to `maxBytes`. Multer's own errors
 * become clear answers: 413 for an oversized file, 400 for a form that is not one file.
 */
export function fileUpload(rule: UploadRule): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: rule.maxBytes, files: 1, fields: 10, fieldSize: 4096, parts: 12 },
  }).single(rule.field);
  return (req, res, next) => {
    upload(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, `the ${rule.what} is larger than the ${megabytes(rule.maxBytes)} MB limit`));
        if (error.code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`send the ${rule.what} as the "${rule.field}" field, one file only`));
        return next(badRequest(`the upload could not be read (${error.message.toLowerCase()})`));
      }
      if (error) return next(error);
      if (!req.file) return next(badRequest(`choose the ${rule.what} to upload (form field "${rule.field}")`));
      next();
    });
  };
}

/** The uploaded file as text; refuses bytes that are not UTF-8 rather than guessing. */
export function uploadedText(file: Express.Multer.File, what: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(file.buffer).replace(/^\uFEFF/, '');
  } catch {
    throw badRequest(`the ${what} is not UTF-8 text: save it as CSV (UTF-8) and try again`);
  }
}
