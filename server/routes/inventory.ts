import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { RouteGroup } from '../auth/route-table';
import { applianceInventoryController } from '../controllers/appliance-inventory';
import { detectionSettingsController } from '../controllers/detection-settings';
import { inventoryImportController } from '../controllers/inventory-import';
import { loggerFilesController } from '../controllers/logger-files';
import { propertiesController } from '../controllers/properties';
import { sensorsController } from '../controllers/sensors';
import { unitsController } from '../controllers/units';
import { ApplianceInventoryService } from '../services/appliance-inventory';
import { DetectionSettingsService } from '../services/detection-settings';
import { InventoryImportService } from '../services/inventory-import';
import { LoggerFilesService } from '../services/logger-files';
import { LoggerHistoryImporter } from '../services/logger-history';
import { PropertiesService } from '../services/properties';
import { SensorsService } from '../services/sensors';
import { UnitsService } from '../services/units';
import { applianceInventoryRoutes } from './appliance-inventory';
import { detectionSettingsRoutes } from './detection-settings';
import { inventoryImportRoutes } from './inventory-import';
import { loggerFilesRoutes } from './logger-files';
import { propertiesRoutes } from './properties';
import { sensorsRoutes } from './sensors';
import { unitsRoutes } from './units';

export interface InventoryServices {
  properties: PropertiesService;
  units: UnitsService;
  appliances: ApplianceInventoryService;
  sensors: SensorsService;
  imports: InventoryImportService;
  detectionSettings: DetectionSettingsService;
  loggerFiles: LoggerFilesService;
}

/**
 * The inventory, the logger-file analysis and the detection settings: their services and
 * route groups, for createApp to mount through the route table.
 */
export function createInventory(deps: { dataSource: DataSource; logger: Logger }): { services: InventoryServices; routes: RouteGroup[] } {
  const { dataSource } = deps;
  const sensors = new SensorsService(dataSource);
  const detectionSettings = new DetectionSettingsService(dataSource);
  const services: InventoryServices = {
    properties: new PropertiesService(dataSource),
    units: new UnitsService(dataSource),
    appliances: new ApplianceInventoryService(dataSource),
    sensors,
    imports: new InventoryImportService(dataSource, deps.logger),
    detectionSettings,
    loggerFiles: new LoggerFilesService(dataSource, detectionSettings, new LoggerHistoryImporter(dataSource)),
  };
  const routes = [
    propertiesRoutes(propertiesController(services.properties)),
    unitsRoutes(unitsController(services.units)),
    applianceInventoryRoutes(applianceInventoryController(services.appliances, sensors)),
    sensorsRoutes(sensorsController(sensors)),
    inventoryImportRoutes(inventoryImportController(services.imports)),
    loggerFilesRoutes(loggerFilesController(services.loggerFiles)),
    detectionSettingsRoutes(detectionSettingsController(detectionSettings)),
  ];
  return { services, routes };
}
