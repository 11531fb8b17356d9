/**
 * Work orders, contractors, coverage and the organization's settings: the contracts
 * shared by client and server. State names are our own (trade words where the trade has
 * them: dispatched, accepted, on site, completed).
 */
import { z } from 'zod';
import { APPLIANCE_STYLES, CAUSE_CODES, SEVERITIES, type ApplianceStyle, type CauseCode, type Severity } from '../domain';
import type { CauseInfo } from '../causes';
import type { IncidentView } from './monitor';
import { ColumnsParam, OpenedRange, SearchText, SORT_DIRECTIONS, WORK_ORDER_COLUMNS } from './tables';

export const PRIORITIES = ['urgent', 'routine'] as const;
export type Priority = (typeof PRIORITIES)[number];

export const WORK_ORDER_STATES = ['dispatched', 'accepted', 'scheduled', 'on-site', 'completed', 'verified', 'declined', 'reopened', 'cancelled'] as const;
export type WorkOrderState = (typeof WORK_ORDER_STATES)[number];

/** States in which the job is still the contractor's to do. */
export const OPEN_WORK_ORDER_STATES: readonly WorkOrderState[] = ['dispatched', 'accepted', 'scheduled', 'on-site', 'reopened'];
/** States that end a work order for good. */
export const FINAL_WORK_ORDER_STATES: readonly WorkOrderState[] = ['verified', 'declined', 'cancelled'];

export const DISPATCH_METHODS = ['coverage-primary', 'coverage-backup', 'manual'] as const;
export type DispatchMethod = (typeof DISPATCH_METHODS)[number];

export const COST_STATUSES = ['none', 'pending', 'approved', 'disputed'] as const;
export type CostStatus = (typeof COST_STATUSES)[number];

export const ATTACHMENT_KINDS = ['before', 'after', 'data-plate', 'invoice', 'photo'] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

export const COVERAGE_RANKS = ['primary', 'backup'] as const;
export type CoverageRank = (typeof COVERAGE_RANKS)[number];

/** ISO 4217 code, upper case. */
const Currency = z.string().regex(/^[A-Z]{3}$/, 'a three-letter currency code such as USD');
const Minutes = (max: number) => z.number().int().min(1).max(max);

// ── organization settings ──────────────────────────────────────────────────────────

export const OrgSettingsSchema = z.object({
  /** An incident at or above this severity opens a service request by itself. */
  autoOpenSeverity: z.enum(SEVERITIES),
  /** Due time of a work order after dispatch, per priority. */
  responseMinutes: z.object({ urgent: Minutes(7 * 24 * 60), routine: Minutes(60 * 24 * 60) }),
  /** An urgent job nobody accepted this long after dispatch goes to the backup contractor. */
  escalateAfterMinutes: Minutes(24 * 60),
  /** After completion, both compartments must be back in their normal range within this time. */
  verificationWindowMinutes: Minutes(7 * 24 * 60),
  /** …and stay there this long. */
  verificationHoldMinutes: Minutes(24 * 60),
  /** An appliance incident waits this long for its neighbours before dispatch, in case it is a power loss. */
  dispatchHoldMinutes: z.number().int().min(0).max(24 * 60),
  currency: Currency,
});
export type OrgSettings = z.infer<typeof OrgSettingsSchema>;

export const UpdateOrgSettingsRequest = OrgSettingsSchema.partial()
  .extend({ responseMinutes: OrgSettingsSchema.shape.responseMinutes.partial().optional() })
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');
export type UpdateOrgSettingsRequest = z.infer<typeof UpdateOrgSettingsRequest>;

export interface OrgSettingsView {
  settings: OrgSettings;
  defaults: OrgSettings;
  /** Why each default is what it is. */
  reasons: Record<keyof OrgSettings, string>;
}

// ── contractors and coverage ───────────────────────────────────────────────────────

export const ContractorIdParams = z.object({ contractorId: z.uuid('not a contractor id') });

export const CreateContractorRequest = z
  .object({
    name: z.string().trim().min(1).max(120),
    email: z.email().max(254),
    phone: z.string().trim().max(40).default(''),
  })
  .strict();
export type CreateContractorRequest = z.infer<typeof CreateContractorRequest>;

export const UpdateContractorRequest = CreateContractorRequest.partial()
  .extend({ archived: z.boolean().optional() })
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');
export type UpdateContractorRequest = z.infer<typeof UpdateContractorRequest>;

/** A contractor user of the organization who works for this company. */
export const ContractorMemberRequest = z.object({ userId: z.uuid() }).strict();

export interface ContractorView {
  id: string;
  name: string;
  email: string;
  phone: string;
  archivedAt: string | null;
  members: { userId: string; displayName: string; email: string }[];
}

export const SetCoverageRequest = z
  .object({
    propertyId: z.uuid(),
    /** Null: every style of the property without a row of its own. */
    applianceStyle: z.enum(APPLIANCE_STYLES).nullable(),
    rank: z.enum(COVERAGE_RANKS),
    /** Null clears the slot. */
    contractorId: z.uuid().nullable(),
  })
  .strict();
export type SetCoverageRequest = z.infer<typeof SetCoverageRequest>;

export const CoverageQuery = z.object({ propertyId: z.uuid().optional() });

export interface CoverageView {
  id: string;
  propertyId: string;
  propertyName: string;
  applianceStyle: ApplianceStyle | null;
  rank: CoverageRank;
  contractorId: string;
  contractorName: string;
}

// ── work orders ───────────────────────────────────────────────────────────────────

export const WorkOrderIdParams = z.object({ workOrderId: z.uuid('not a work order id') });

export const WORK_ORDER_SORTS = ['dueAt', 'dispatchedAt', 'state', 'priority', 'contractor', 'property', 'unit', 'title'] as const;
export type WorkOrderSort = (typeof WORK_ORDER_SORTS)[number];

export const WorkOrderQuery = z.object({
  status: z.enum(['open', 'overdue', 'completed', 'all']).default('open'),
  /** One state exactly, within the status. */
  state: z.enum(WORK_ORDER_STATES).optional(),
  propertyId: z.uuid().optional(),
  serviceRequestId: z.uuid().optional(),
  priority: z.enum(PRIORITIES).optional(),
  /** The dispatch time, the work order's opening. */
  ...OpenedRange,
  /** Over title, property name, unit label and the contractor's name. */
  q: SearchText,
  sort: z.enum(WORK_ORDER_SORTS).default('dueAt'),
  dir: z.enum(SORT_DIRECTIONS).default('asc'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type WorkOrderQuery = z.infer<typeof WorkOrderQuery>;

export const WorkOrderExportQuery = WorkOrderQuery.omit({ page: true, pageSize: true }).extend({ columns: ColumnsParam(WORK_ORDER_COLUMNS) });
export type WorkOrderExportQuery = z.infer<typeof WorkOrderExportQuery>;

export const DeclineRequest = z.object({ reason: z.string().trim().min(1).max(1000) }).strict();

const IsoTime = z.iso.datetime({ offset: true });

export const ScheduleRequest = z
  .object({ startAt: IsoTime, endAt: IsoTime })
  .strict()
  .refine((v) => Date.parse(v.endAt) > Date.parse(v.startAt), { message: 'the visit must end after it starts', path: ['endAt'] });
export type ScheduleRequest = z.infer<typeof ScheduleRequest>;

export const ArriveRequest = z.object({ notes: z.string().max(4000).default('') }).strict();

export const CauseFound = z.union([z.enum(CAUSE_CODES), z.literal('other')]);
export type CauseFound = z.infer<typeof CauseFound>;

export const CompleteRequest = z
  .object({
    causeFound: CauseFound,
    causeNote: z.string().trim().max(1000).optional(),
    findings: z.string().trim().min(1).max(8000),
    notes: z.string().max(8000).optional(),
  })
  .strict()
  .refine((v) => v.causeFound !== 'other' || !!v.causeNote, { message: 'say what the cause was', path: ['causeNote'] });
export type CompleteRequest = z.infer<typeof CompleteRequest>;

export const UpdateWorkOrderRequest = z
  .object({ findings: z.string().max(8000).optional(), notes: z.string().max(8000).optional() })
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');

export const RecordPartRequest = z
  .object({
    name: z.string().trim().min(1).max(200),
    quantity: z.number().int().min(1).max(1000),
    unitCostCents: z.number().int().min(0).max(100_000_00),
    currency: Currency.optional(),
  })
  .strict();
export type RecordPartRequest = z.infer<typeof RecordPartRequest>;

export const RecordLabourRequest = z
  .object({ minutes: z.number().int().min(1).max(24 * 60), hourlyRateCents: z.number().int().min(0).max(10_000_00) })
  .strict();
export type RecordLabourRequest = z.infer<typeof RecordLabourRequest>;

export const CostDecisionRequest = z.object({ note: z.string().trim().max(2000).optional() }).strict();
export const CostDisputeRequest = z.object({ note: z.string().trim().min(1).max(2000) }).strict();

export interface MoneyView {
  cents: number;
  currency: string;
}

export interface PartView {
  id: string;
  name: string;
  quantity: number;
  unitCostCents: number;
  currency: string;
}

export interface LabourView {
  id: string;
  minutes: number;
  hourlyRateCents: number;
  currency: string;
}

export interface VisitView {
  id: string;
  arrivedAt: string;
  leftAt: string | null;
  notes: string;
}

export interface WorkOrderEventView {
  at: string;
  actor: { userId: string | null; displayName: string } | null;
  type: string;
  fromState: WorkOrderState | null;
  toState: WorkOrderState | null;
  detail: Record<string, unknown>;
}

export interface AttachmentView {
  id: string;
  kind: AttachmentKind;
  contentType: string;
  sizeBytes: number;
  displayName: string;
  url: string;
  thumbnailUrl: string | null;
  createdAt: string;
}

export interface AccessWindow {
  from: string;
  to: string;
}

export interface WorkOrderSummary {
  id: string;
  serviceRequestId: string;
  state: WorkOrderState;
  priority: Priority;
  title: string;
  contractor: { id: string; name: string };
  /** timeZone: the property's IANA zone, in which its times are shown. */
  property: { id: string; name: string; address: string; timeZone: string };
  unit: { id: string; label: string } | null;
  applianceId: string | null;
  dispatchedAt: string;
  dueAt: string;
  overdue: boolean;
  scheduledStartAt: string | null;
  scheduledEndAt: string | null;
  /** The engine's most likely failed part, when an incident opened the request. */
  suspectedCause: CauseCode | null;
  /** When the tenant said the technician can come in, from their reports. */
  accessWindows: AccessWindow[];
  petPresent: boolean;
}

export interface DiagnosisView {
  incident: IncidentView | null;
  topCause: CauseCode | null;
  cause: CauseInfo | null;
  severity: Severity | null;
  /** From the first sign of trouble to now (or its end): the range for the temperature chart. */
  historyFromMs: number | null;
  historyToMs: number | null;
}

export interface WorkOrderView extends WorkOrderSummary {
  dispatchMethod: DispatchMethod;
  acceptedAt: string | null;
  completedAt: string | null;
  verifiedAt: string | null;
  verificationDueAt: string | null;
  reopenedCount: number;
  escalatedAt: string | null;
  causeFound: CauseFound | null;
  causeNote: string | null;
  findings: string;
  notes: string;
  appliance: { id: string; style: ApplianceStyle; model: string; serial: string } | null;
  diagnosis: DiagnosisView;
  /** Shown wherever someone is told to touch an appliance. */
  cautions: readonly string[];
  symptoms: string[];
  visits: VisitView[];
  parts: PartView[];
  labour: LabourView[];
  totals: { parts: MoneyView; labour: MoneyView; total: MoneyView };
  costStatus: CostStatus;
  costNote: string | null;
  attachments: AttachmentView[];
  events: WorkOrderEventView[];
}

export const AttachmentIdParams = z.object({ attachmentId: z.uuid('not an attachment id') });
export const UploadAttachmentFields = z.object({ kind: z.enum(ATTACHMENT_KINDS).default('photo') });

/** Uploads accepted (checked by content, not by name) and their size limit. */
export const UPLOAD_CONTENT_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'application/pdf'] as const;
export const UPLOAD_MAX_BYTES = 10 * 1024 * 1024;

export const NotificationPreferenceRequest = z.object({ muteNonUrgent: z.boolean() }).strict();
export interface NotificationPreferenceView {
  muteNonUrgent: boolean;
}
