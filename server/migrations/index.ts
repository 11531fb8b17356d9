// Migrations in the order they run. Add a new one at the end (see DEVELOPERS.md).
import { CoreSchema1764633600000 } from './1764633600000-core-schema';
import { TelemetryStorage1796163938389 } from './1796163938389-telemetry-storage';
import { Accounts1796164600000 } from './1796164600000-accounts';
import { Monitor1796170000000 } from './1796170000000-monitor';
import { WorkOrders1796180000000 } from './1796180000000-work-orders';
import { LoggerFilesAndDetectionSettings1796190000000 } from './1796190000000-logger-files-and-detection-settings';
import { WorkOrderRequestIndex1796200000000 } from './1796200000000-work-order-request-index';
import { SensorLastHeard1796210000000 } from './1796210000000-sensor-last-heard';

export const MIGRATIONS = [CoreSchema1764633600000, TelemetryStorage1796163938389, Accounts1796164600000, Monitor1796170000000, WorkOrders1796180000000, LoggerFilesAndDetectionSettings1796190000000, WorkOrderRequestIndex1796200000000, SensorLastHeard1796210000000];
