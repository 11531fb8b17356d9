import { IMPORT_MAX_BYTES, ImportIdParams } from '../../shared/api/inventory';
import { RouteGroup } from '../auth/route-table';
import type { inventoryImportController } from '../controllers/inventory-import';
import { fileUpload } from '../middleware/file-upload';
import { validate } from '../middleware/validate';
import { inventoryRule } from './properties';

/** The CSV travels as multipart field "file"; the JSON body limit does not apply to it. */
export function inventoryImportRoutes(controller: ReturnType<typeof inventoryImportController>): RouteGroup {
  const upload = fileUpload({ field: 'file', maxBytes: IMPORT_MAX_BYTES, what: 'inventory file' });
  return new RouteGroup('/api/inventory/import')
    .post('/preview', inventoryRule('check an inventory CSV: what it would create, and every row error; writes nothing'), upload, controller.preview)
    .post('/', inventoryRule('import an inventory CSV, all or nothing, in the background'), upload, controller.start)
    .get('/:importId', inventoryRule("an import's progress and outcome"), validate({ params: ImportIdParams }), controller.status);
}
