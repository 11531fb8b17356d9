import type { Request, Response } from 'express';
import { actorOf } from '../auth/actor';
import { badRequest } from '../errors';
import { uploadedText } from '../middleware/file-upload';
import type { InventoryImportService } from '../services/inventory-import';

function uploaded(req: Request): { fileName: string; text: string } {
  if (!req.file) throw badRequest('choose a CSV file to import');
  return { fileName: req.file.originalname || 'inventory.csv', text: uploadedText(req.file, 'inventory file') };
}

export function inventoryImportController(imports: InventoryImportService) {
  return {
    preview: async (req: Request, res: Response) => {
      const { fileName, text } = uploaded(req);
      res.json(await imports.preview(actorOf(req), fileName, text));
    },
    start: async (req: Request, res: Response) => {
      const { fileName, text } = uploaded(req);
      res.status(202).json(await imports.start(actorOf(req), fileName, text));
    },
    status: async (req: Request, res: Response) => {
      res.json(imports.status(actorOf(req), req.params.importId as string));
    },
  };
}
