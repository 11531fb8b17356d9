/**
 * The live monitor's shapes: incidents and appliance health as the API answers them, and
 * the live events the web app's feed receives. Shared by client and server.
 */
import { z } from 'zod';
import { CAUSE_CODES, FINDING_KINDS, SEVERITIES, type CauseCode, type FindingKind, type Health, type Severity } from '../domain';
import { ColumnsParam, INCIDENT_COLUMNS, OpenedRange, SearchText, SORT_DIRECTIONS, type PlaceLabels } from './tables';

export const INCIDENT_LEVELS = ['appliance', 'property'] as const;
export type IncidentLevel = (typeof INCIDENT_LEVELS)[number];

/** `repair`: the appliance; `sensor`: the sensor itself; `power`: a property's supply. */
export const INCIDENT_LANES = ['repair', 'sensor', 'power'] as const;
export type IncidentLane = (typeof INCIDENT_LANES)[number];

export interface CauseView {
  code: CauseCode;
  confidence: number;
}

export interface IncidentView {
  id: string;
  level: IncidentLevel;
  lane: IncidentLane;
  /** The most telling kind among its findings (no-cooling over over-temperature over a trend). */
  kind: FindingKind;
  kinds: FindingKind[];
  organizationId: string;
  propertyId: string;
  unitId: string | null;
  applianceId: string | null;
  startedAt: string;
  openedAt: string;
  closedAt: string | null;
  severity: Severity;
  topCause: CauseCode | null;
  probableCauses: CauseView[];
  minutesAbove4c: number;
  /** A unit incident explained by a property's power loss points at that incident. */
  propertyIncidentId: string | null;
  /** For a property incident: the appliances warming together. */
  applianceIds: string[];
}

export interface ApplianceHealthView {
  applianceId: string;
  health: Health;
  healthSince: string;
  lastReadingAt: string | null;
  freshFoodC: number | null;
  freezerC: number | null;
}

/** Columns the incident list sorts on (severity by rank, not by name). */
export const INCIDENT_SORTS = ['openedAt', 'startedAt', 'closedAt', 'severity', 'kind', 'property', 'unit', 'minutesAbove4c'] as const;
export type IncidentSort = (typeof INCIDENT_SORTS)[number];

export const IncidentQuery = z.object({
  status: z.enum(['open', 'closed', 'all']).default('open'),
  applianceId: z.uuid().optional(),
  propertyId: z.uuid().optional(),
  severity: z.enum(SEVERITIES).optional(),
  kind: z.enum(FINDING_KINDS).optional(),
  cause: z.enum(CAUSE_CODES).optional(),
  ...OpenedRange,
  /** Over property name, unit label, appliance model and serial. */
  q: SearchText,
  sort: z.enum(INCIDENT_SORTS).default('openedAt'),
  dir: z.enum(SORT_DIRECTIONS).default('desc'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type IncidentQuery = z.infer<typeof IncidentQuery>;

export const IncidentExportQuery = IncidentQuery.omit({ page: true, pageSize: true }).extend({ columns: ColumnsParam(INCIDENT_COLUMNS) });
export type IncidentExportQuery = z.infer<typeof IncidentExportQuery>;

/** An incident as the list answers it: with the names of where it is. */
export interface IncidentListItem extends IncidentView {
  place: PlaceLabels;
}

export const IncidentIdParams = z.object({ incidentId: z.uuid('not an incident id') });

/** Where an event happened, so the live feed can send it only to people who may see it. */
export interface EventPlace {
  organizationId: string;
  propertyId: string;
  unitId: string | null;
  applianceId: string | null;
}

export interface HealthChangedEvent extends EventPlace {
  type: 'appliance.health-changed';
  atMs: number;
  health: Health;
  previous: Health | null;
}

export interface IncidentEvent extends EventPlace {
  type: 'incident.opened' | 'incident.updated' | 'incident.closed';
  atMs: number;
  incident: IncidentView;
}

export interface WorkOrderChangedEvent extends EventPlace {
  type: 'work-order.changed';
  atMs: number;
  workOrderId: string;
  serviceRequestId: string;
  contractorId: string | null;
  state: string;
  /** What happened: a state name, 'escalated', 'overdue', 'part-recorded', … */
  change: string;
}

export interface ServiceRequestChangedEvent extends EventPlace {
  type: 'service-request.changed';
  atMs: number;
  serviceRequestId: string;
  status: string;
  change: string;
}

/** Everything the live feed may carry. */
export type LiveEvent = HealthChangedEvent | IncidentEvent | WorkOrderChangedEvent | ServiceRequestChangedEvent;
export type LiveEventType = LiveEvent['type'];
