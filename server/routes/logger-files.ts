import { AttachLoggerFileRequest, LOGGER_FILE_MAX_BYTES, LoggerFileIdParams, LoggerFileQuery } from '../../shared/api/logger-files';
import { RouteGroup } from '../auth/route-table';
import type { loggerFilesController } from '../controllers/logger-files';
import { fileUpload } from '../middleware/file-upload';
import { validate } from '../middleware/validate';
import { inventoryRule } from './properties';

export function loggerFilesRoutes(controller: ReturnType<typeof loggerFilesController>): RouteGroup {
  const params = { params: LoggerFileIdParams };
  const upload = fileUpload({ field: 'file', maxBytes: LOGGER_FILE_MAX_BYTES, what: 'logger file' });
  return new RouteGroup('/api/logger-files')
    .get('/', inventoryRule('logger files analysed in the organization, newest first'), validate({ query: LoggerFileQuery }), controller.list)
    .post('/', inventoryRule('upload a logger CSV: the engine’s findings and a downsampled chart'), upload, controller.upload)
    .get('/:loggerFileId', inventoryRule('one analysed logger file with its chart and findings'), validate(params), controller.get)
    .delete('/:loggerFileId', inventoryRule('forget an analysed logger file (attached readings stay)'), validate(params), controller.remove)
    .post('/:loggerFileId/attach', inventoryRule("add a logger file's readings to an appliance's history, marked as imported"), validate({ ...params, body: AttachLoggerFileRequest }), controller.attach);
}
