// The live monitor's and the work-order loop's entities, spread into ENTITIES (index.ts).
import { ApplianceMonitor } from './appliance-monitor';
import { Attachment } from './attachment';
import { Contractor } from './contractor';
import { ContractorMember } from './contractor-member';
import { Coverage } from './coverage';
import { FindingRecord } from './finding-record';
import { IncidentRecord } from './incident-record';
import { NotificationPreference } from './notification-preference';
import { OrgSettingsRecord } from './org-settings-record';
import { ServiceRequest } from './service-request';
import { TenantReportRecord } from './tenant-report';
import { WorkOrder } from './work-order';
import { WorkOrderEvent } from './work-order-event';
import { WorkOrderLabour } from './work-order-labour';
import { WorkOrderPart } from './work-order-part';
import { WorkOrderVisit } from './work-order-visit';

export {
  ApplianceMonitor,
  Attachment,
  Contractor,
  ContractorMember,
  Coverage,
  FindingRecord,
  IncidentRecord,
  NotificationPreference,
  OrgSettingsRecord,
  ServiceRequest,
  TenantReportRecord,
  WorkOrder,
  WorkOrderEvent,
  WorkOrderLabour,
  WorkOrderPart,
  WorkOrderVisit,
};

export const WORK_ORDER_ENTITIES = [
  ApplianceMonitor,
  IncidentRecord,
  FindingRecord,
  OrgSettingsRecord,
  Contractor,
  ContractorMember,
  Coverage,
  ServiceRequest,
  TenantReportRecord,
  WorkOrder,
  WorkOrderEvent,
  WorkOrderVisit,
  WorkOrderPart,
  WorkOrderLabour,
  Attachment,
  NotificationPreference,
];
