// The live monitor's and the work-order loop's entities, spread into ENTITIES (index.ts).
import { ApplianceMonitor } from './appliance-monitor';
import { FindingRecord } from './finding-record';
import { IncidentRecord } from './incident-record';

export { ApplianceMonitor, FindingRecord, IncidentRecord };

export const WORK_ORDER_ENTITIES = [ApplianceMonitor, IncidentRecord, FindingRecord];
