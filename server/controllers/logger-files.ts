import type { Request, Response } from 'express';
import { LoggerUploadFields, type AttachLoggerFileRequest, type LoggerFileQuery } from '../../shared/api/logger-files';
import { actorOf } from '../auth/actor';
import { badRequest } from '../errors';
import { uploadedText } from '../middleware/file-upload';
import type { LoggerFilesService } from '../services/logger-files';

export function loggerFilesController(files: LoggerFilesService) {
  const id = (req: Request) => req.params.loggerFileId as string;
  return {
    list: async (req: Request, res: Response) => {
      res.json(await files.list(actorOf(req), req.query as unknown as LoggerFileQuery));
    },
    upload: async (req: Request, res: Response) => {
      if (!req.file) throw badRequest('choose a logger file to upload');
      // Multipart text fields arrive after multer, so they are checked here rather than by validate().
      const fields = LoggerUploadFields.parse(req.body ?? {});
      const text = uploadedText(req.file, 'logger file');
      const { view, created } = await files.upload(actorOf(req), { fileName: req.file.originalname || 'logger.csv', text, sizeBytes: req.file.size, style: fields.style });
      res.status(created ? 201 : 200).json(view);
    },
    get: async (req: Request, res: Response) => {
      res.json(await files.get(actorOf(req), id(req)));
    },
    remove: async (req: Request, res: Response) => {
      await files.remove(actorOf(req), id(req));
      res.status(204).end();
    },
    attach: async (req: Request, res: Response) => {
      const body: AttachLoggerFileRequest = req.body;
      res.json(await files.attach(actorOf(req), id(req), body.applianceId));
    },
  };
}
