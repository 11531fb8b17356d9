/** The tenant's side: their appliance's status, food-safety guidance and the problem report. */
import { z } from 'zod';
import type { ApplianceStyle, Health } from '../domain';
import type { ServiceRequestView } from './service-requests';

/** What is wrong, in plain words (the report form's checkboxes). */
export const SYMPTOMS = {
  'fridge-not-cold': 'The fridge is not cold',
  'freezer-not-cold': 'The freezer is not cold',
  'water-on-floor': 'Water on the floor',
  noise: 'Strange or loud noise',
  'ice-build-up': 'Ice building up',
  'door-wont-seal': "A door won't close or seal",
  other: 'Something else',
} as const;
export type Symptom = keyof typeof SYMPTOMS;
export const SYMPTOM_CODES = Object.keys(SYMPTOMS) as Symptom[];

/** Symptoms that put food at risk: the request is urgent. */
export const URGENT_SYMPTOMS: readonly Symptom[] = ['fridge-not-cold', 'freezer-not-cold'];

const IsoTime = z.iso.datetime({ offset: true });

export const AccessWindowSchema = z
  .object({ from: IsoTime, to: IsoTime })
  .refine((w) => Date.parse(w.to) > Date.parse(w.from), { message: 'a window must end after it starts', path: ['to'] });

/**
 * The report form, sent as multipart/form-data: this object as JSON in the field `report`,
 * and up to five files in the field `photos`.
 */
export const TenantReportSchema = z
  .object({
    /** Needed only when the unit has more than one appliance. */
    applianceId: z.uuid().optional(),
    symptoms: z.array(z.enum(SYMPTOM_CODES as [Symptom, ...Symptom[]])).min(1, 'tick at least one box').max(SYMPTOM_CODES.length),
    description: z.string().trim().max(4000).default(''),
    accessWindows: z.array(AccessWindowSchema).max(10).default([]),
    petPresent: z.boolean().default(false),
  })
  .strict()
  .refine((r) => !r.symptoms.includes('other') || r.description.length > 0, { message: 'say what else is wrong', path: ['description'] });
export type TenantReport = z.infer<typeof TenantReportSchema>;
export type TenantReportInput = z.input<typeof TenantReportSchema>;

export const TENANT_PHOTO_LIMIT = 5;

export interface FoodSafetyGuidance {
  /** True once the fresh-food section has been above 40 °F (4.4 °C) during the current trouble. */
  atRisk: boolean;
  minutesAbove4c: number;
  headline: string;
  /** What to do, in order. */
  advice: string[];
  /** Where the advice comes from, and who has the last word. */
  sources: string[];
}

export interface TenantApplianceView {
  id: string;
  style: ApplianceStyle;
  health: Health;
  /** One sentence in plain words for the health. */
  healthText: string;
  freshFoodC: number | null;
  freezerC: number | null;
  lastReadingAt: string | null;
  guidance: FoodSafetyGuidance;
  openRequest: ServiceRequestView | null;
}

export interface TenantHomeView {
  unit: { id: string; label: string; propertyName: string };
  appliances: TenantApplianceView[];
}

export interface TenantReportResult {
  /** True when the report joined a request that was already open for this appliance. */
  attached: boolean;
  request: ServiceRequestView;
}
