import { DetectionOverridesSchema, StyleParams } from '../../shared/api/settings';
import { RouteGroup } from '../auth/route-table';
import type { detectionSettingsController } from '../controllers/detection-settings';
import { validate } from '../middleware/validate';
import { inventoryRule } from './properties';

export function detectionSettingsRoutes(controller: ReturnType<typeof detectionSettingsController>): RouteGroup {
  return new RouteGroup('/api/settings/detection')
    .get('/', inventoryRule('detection thresholds and grace periods per appliance style, with defaults and their sources'), controller.view)
    .put('/:style', inventoryRule("replace an appliance style's detection overrides"), validate({ params: StyleParams, body: DetectionOverridesSchema }), controller.replace)
    .delete('/:style', inventoryRule('return an appliance style to the default detection settings'), validate({ params: StyleParams }), controller.reset);
}
