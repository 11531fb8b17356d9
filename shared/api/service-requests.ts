/** Service requests: from the monitor, a tenant's report or a manager. Shared by client and server. */
import { z } from 'zod';
import { CAUSE_CODES } from '../domain';
import type { IncidentView } from './monitor';
import { ColumnsParam, OpenedRange, REQUEST_COLUMNS, SearchText, SORT_DIRECTIONS, type PlaceLabels } from './tables';
import { PRIORITIES, type Priority, type WorkOrderState } from './work-orders';

export const REQUEST_STATUSES = ['open', 'closed', 'cancelled', 'merged'] as const;
export type RequestStatus = (typeof REQUEST_STATUSES)[number];

export const REQUEST_SOURCES = ['monitor', 'tenant', 'manager'] as const;
export type RequestSource = (typeof REQUEST_SOURCES)[number];

export const REQUEST_LEVELS = ['appliance', 'property'] as const;
export type RequestLevel = (typeof REQUEST_LEVELS)[number];

export const ServiceRequestIdParams = z.object({ requestId: z.uuid('not a service request id') });

export const REQUEST_SORTS = ['openedAt', 'closedAt', 'priority', 'status', 'title', 'property', 'unit'] as const;
export type RequestSort = (typeof REQUEST_SORTS)[number];

export const ServiceRequestQuery = z.object({
  status: z.enum([...REQUEST_STATUSES, 'all']).default('open'),
  propertyId: z.uuid().optional(),
  applianceId: z.uuid().optional(),
  priority: z.enum(PRIORITIES).optional(),
  source: z.enum(REQUEST_SOURCES).optional(),
  /** The probable cause of the incident behind the request. */
  cause: z.enum(CAUSE_CODES).optional(),
  ...OpenedRange,
  /** Over title, property name, unit label, appliance model and serial, and the contractor's name. */
  q: SearchText,
  sort: z.enum(REQUEST_SORTS).default('openedAt'),
  dir: z.enum(SORT_DIRECTIONS).default('desc'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type ServiceRequestQuery = z.infer<typeof ServiceRequestQuery>;

export const ServiceRequestExportQuery = ServiceRequestQuery.omit({ page: true, pageSize: true }).extend({ columns: ColumnsParam(REQUEST_COLUMNS) });
export type ServiceRequestExportQuery = z.infer<typeof ServiceRequestExportQuery>;

/** A manager opens a request by hand. */
export const CreateServiceRequest = z
  .object({
    applianceId: z.uuid(),
    priority: z.enum(PRIORITIES).default('routine'),
    title: z.string().trim().min(1).max(200),
    description: z.string().trim().max(8000).default(''),
  })
  .strict();
export type CreateServiceRequest = z.infer<typeof CreateServiceRequest>;

export const CancelServiceRequest = z.object({ reason: z.string().trim().min(1).max(1000) }).strict();
export const MergeServiceRequest = z.object({ intoRequestId: z.uuid() }).strict();
export const ReprioritiseServiceRequest = z.object({ priority: z.enum(PRIORITIES) }).strict();
/** Without a contractor: the one covering the property and appliance style (primary). */
export const DispatchServiceRequest = z.object({ contractorId: z.uuid().optional() }).strict();

/** Where a request stands, in the words the tenant sees. */
export const REQUEST_PROGRESS = ['received', 'dispatched', 'accepted', 'scheduled', 'technician on site', 'completed', 'verified', 'closed', 'cancelled'] as const;
export type RequestProgress = (typeof REQUEST_PROGRESS)[number];

export interface ServiceRequestView {
  id: string;
  level: RequestLevel;
  source: RequestSource;
  status: RequestStatus;
  priority: Priority;
  title: string;
  description: string;
  symptoms: string[];
  propertyId: string;
  unitId: string | null;
  applianceId: string | null;
  openedAt: string;
  closedAt: string | null;
  closeReason: string | null;
  mergedIntoId: string | null;
  firstVisitFix: boolean | null;
  incident: IncidentView | null;
  progress: RequestProgress;
  workOrder: { id: string; state: WorkOrderState; contractorName: string; scheduledStartAt: string | null; scheduledEndAt: string | null; dueAt: string } | null;
  /** Names of where it is, and the property's time zone for its dates. */
  place: PlaceLabels;
  reports: { id: string; createdAt: string; symptoms: string[]; description: string; petPresent: boolean; accessWindows: { from: string; to: string }[]; photoIds: string[] }[];
}
