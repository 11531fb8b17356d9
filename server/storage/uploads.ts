/**
 * Uploads: multer keeps the file in memory (size-limited), then the content decides what
 * it is (file-type reads the magic bytes; the name and the client's Content-Type are
 * ignored). Only JPEG, PNG, WebP and PDF pass. Images get a WebP thumbnail (sharp).
 * Object keys are random; the uploader's file name is kept only, cleaned, for display,
 * and a name that tries to climb directories is refused outright.
 */
import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';
import multer from 'multer';
import sharp from 'sharp';
import { UPLOAD_CONTENT_TYPES, UPLOAD_MAX_BYTES } from '../../shared/api/work-orders';
import { badRequest, HttpError } from '../errors';

export type UploadContentType = (typeof UPLOAD_CONTENT_TYPES)[number];

export interface InspectedUpload {
  buffer: Buffer;
  contentType: UploadContentType;
  extension: string;
  sizeBytes: number;
  displayName: string;
  width: number | null;
  height: number | null;
}

export interface PreparedUpload extends InspectedUpload {
  objectKey: string;
  thumbnail: { key: string; buffer: Buffer } | null;
}

export const THUMBNAIL_PX = 320;
const MAX_NAME_LENGTH = 200;

/** Multer errors become the right status: 413 for too large, 400 for the rest. */
export function receiveFiles(field: string, maxCount: number, maxBytes = UPLOAD_MAX_BYTES): RequestHandler {
  // preservePath: the name arrives as sent, so a name with folders is seen (and refused), not silently cut.
  const limits = { fileSize: maxBytes, files: maxCount, fields: 20, fieldSize: 64 * 1024 };
  const upload = multer({ storage: multer.memoryStorage(), preservePath: true, limits }).array(field, maxCount);
  return (req, res, next) => {
    upload(req, res, (error?: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, `a file may be at most ${Math.round(maxBytes / (1024 * 1024))} MB`));
        return next(badRequest(`upload refused: ${error.message}`));
      }
      next(error);
    });
  };
}

/** Refuses names with directory parts, parent references or control characters; returns it trimmed. */
export function safeDisplayName(name: string): string {
  const trimmed = name.trim();
  // eslint-disable-next-line no-control-regex
  if (!trimmed || trimmed.length > MAX_NAME_LENGTH || /[\\/\u0000-\u001f\u007f]/.test(trimmed) || trimmed.split('.').every((part) => part === '') || trimmed.includes('..')) {
    throw badRequest('the file name is not acceptable: use a plain name without folders');
  }
  return trimmed;
}

/** What the bytes are, by their content. */
export async function sniff(buffer: Buffer): Promise<{ contentType: UploadContentType; extension: string }> {
  const { fileTypeFromBuffer } = await import('file-type');
  const type = await fileTypeFromBuffer(buffer);
  if (!type || !(UPLOAD_CONTENT_TYPES as readonly string[]).includes(type.mime)) {
    throw new HttpError(415, 'only JPEG, PNG or WebP photos and PDF documents can be uploaded');
  }
  return { contentType: type.mime as UploadContentType, extension: type.ext };
}

export async function inspect(file: { buffer: Buffer; originalname: string; size: number }): Promise<InspectedUpload> {
  const displayName = safeDisplayName(file.originalname);
  if (file.size === 0) throw badRequest('the file is empty');
  const { contentType, extension } = await sniff(file.buffer);
  let width: number | null = null;
  let height: number | null = null;
  if (contentType !== 'application/pdf') {
    const metadata = await sharp(file.buffer).metadata().catch(() => null);
    if (!metadata?.width || !metadata.height) throw new HttpError(415, 'the image cannot be read');
    width = metadata.width;
    height = metadata.height;
  }
  return { buffer: file.buffer, contentType, extension, sizeBytes: file.size, displayName, width, height };
}

/** A random key under the organization; the thumbnail sits beside it. */
export async function prepare(upload: InspectedUpload, organizationId: string): Promise<PreparedUpload> {
  const objectKey = `${organizationId}/${randomUUID()}.${upload.extension}`;
  if (upload.contentType === 'application/pdf') return { ...upload, objectKey, thumbnail: null };
  // rotate() applies the EXIF orientation; the re-encoded thumbnail carries no metadata.
  const buffer = await sharp(upload.buffer).rotate().resize(THUMBNAIL_PX, THUMBNAIL_PX, { fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
  return { ...upload, objectKey, thumbnail: { key: objectKey.replace(/\.[a-z0-9]+$/, '.thumb.webp'), buffer } };
}
