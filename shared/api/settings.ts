/**
 * Detection settings a manager may change per appliance style: the food-safety limits
 * (never looser than the FDA's), grace periods and warming thresholds. Everything else
 * keeps the engine's documented default (server/detection/settings.ts).
 */
import { z } from 'zod';
import { APPLIANCE_STYLES, type ApplianceStyle, type Probe } from '../domain';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../temperature';

export const DETECTION_SETTING_KEYS = [
  'freshFoodLimitC',
  'freshOverTempGraceMinutes',
  'freshMinRiseC',
  'freezerLimitC',
  'freezerOverTempGraceMinutes',
  'freezerMinRiseC',
  'sustainMinutes',
  'silentAfterMinutes',
] as const;
export type DetectionSettingKey = (typeof DETECTION_SETTING_KEYS)[number];

/** `temperature` is a °C reading, `temperature-delta` a °C difference (no 32° offset in °F), `minutes` a duration. */
export type SettingKind = 'temperature' | 'temperature-delta' | 'minutes';

export interface DetectionSettingField {
  key: DetectionSettingKey;
  label: string;
  help: string;
  kind: SettingKind;
  /** The compartment it applies to; null for the whole appliance. */
  probe: Probe | null;
  /** Bounds in °C or minutes. */
  min: number;
  max: number;
}

export const DETECTION_SETTING_FIELDS: readonly DetectionSettingField[] = [
  {
    key: 'freshFoodLimitC',
    label: 'Fresh-food limit',
    help: 'Fresh food above this is warm. It may be stricter than 40 °F but never looser (U.S. FDA).',
    kind: 'temperature',
    probe: 'fresh_food',
    min: 0,
    max: FRESH_FOOD_LIMIT_C,
  },
  {
    key: 'freshOverTempGraceMinutes',
    label: 'Fresh-food grace period',
    help: 'How long the fresh-food section may stay above its limit (a door opening, a defrost) before it counts as warm. At most 2 hours: the USDA discard rule.',
    kind: 'minutes',
    probe: 'fresh_food',
    min: 5,
    max: 120,
  },
  {
    key: 'freshMinRiseC',
    label: 'Fresh-food warming threshold',
    help: 'How far above its own normal the fresh-food level must rise before a warming trend is reported.',
    kind: 'temperature-delta',
    probe: 'fresh_food',
    min: 0.5,
    max: 5,
  },
  {
    key: 'freezerLimitC',
    label: 'Freezer limit',
    help: 'A freezer above this is warm. It may be stricter than 0 °F but never looser (U.S. FDA).',
    kind: 'temperature',
    probe: 'freezer',
    min: -30,
    max: FREEZER_LIMIT_C,
  },
  {
    key: 'freezerOverTempGraceMinutes',
    label: 'Freezer grace period',
    help: 'How long the freezer may stay above its limit (an automatic defrost and its recovery) before it counts as warm.',
    kind: 'minutes',
    probe: 'freezer',
    min: 5,
    max: 240,
  },
  {
    key: 'freezerMinRiseC',
    label: 'Freezer warming threshold',
    help: 'How far above its own normal the freezer level must rise before a warming trend is reported.',
    kind: 'temperature-delta',
    probe: 'freezer',
    min: 0.5,
    max: 8,
  },
  {
    key: 'sustainMinutes',
    label: 'Warming must last',
    help: 'A rise must stay above the warming threshold this long before it is reported as a trend.',
    kind: 'minutes',
    probe: null,
    min: 15,
    max: 240,
  },
  {
    key: 'silentAfterMinutes',
    label: 'Silent after',
    help: 'With no reading for this long the sensor counts as silent.',
    kind: 'minutes',
    probe: null,
    min: 15,
    max: 1440,
  },
];

export const FIELD_BY_KEY = Object.fromEntries(DETECTION_SETTING_FIELDS.map((field) => [field.key, field])) as Record<DetectionSettingKey, DetectionSettingField>;

/** The fields that apply to a style: a fresh-food-only unit has no freezer settings. */
export function fieldsFor(probes: readonly Probe[]): DetectionSettingField[] {
  return DETECTION_SETTING_FIELDS.filter((field) => field.probe === null || probes.includes(field.probe));
}

function bounded(key: DetectionSettingKey) {
  const field = FIELD_BY_KEY[key];
  const unit = field.kind === 'minutes' ? ' min' : ' °C';
  const show = (value: number) => `${Math.round(value * 100) / 100}${unit}`;
  return z
    .number(`${field.label}: enter a number`)
    .refine(Number.isFinite, `${field.label}: enter a number`)
    .refine((value) => value >= field.min - 1e-9, `${field.label}: at least ${show(field.min)}`)
    .refine((value) => value <= field.max + 1e-9, `${field.label}: at most ${show(field.max)}`)
    .refine((value) => field.kind !== 'minutes' || Number.isInteger(value), `${field.label}: a whole number of minutes`)
    .optional();
}

/** `PUT /api/settings/detection/:style`: the complete overrides of that style; a key left out takes its default. */
export const DetectionOverridesSchema = z
  .object({
    freshFoodLimitC: bounded('freshFoodLimitC'),
    freshOverTempGraceMinutes: bounded('freshOverTempGraceMinutes'),
    freshMinRiseC: bounded('freshMinRiseC'),
    freezerLimitC: bounded('freezerLimitC'),
    freezerOverTempGraceMinutes: bounded('freezerOverTempGraceMinutes'),
    freezerMinRiseC: bounded('freezerMinRiseC'),
    sustainMinutes: bounded('sustainMinutes'),
    silentAfterMinutes: bounded('silentAfterMinutes'),
  })
  .strict();
export type DetectionOverrides = z.infer<typeof DetectionOverridesSchema>;

export const StyleParams = z.object({ style: z.enum(APPLIANCE_STYLES, 'not an appliance style') });

export interface DetectionFieldView extends DetectionSettingField {
  defaultValue: number;
  /** Why the default is what it is, with its source or "common practice". */
  reason: string;
}

export interface StyleSettingsView {
  style: ApplianceStyle;
  probes: Probe[];
  overrides: DetectionOverrides;
  updatedAt: string | null;
  updatedBy: string | null;
}

export interface DetectionSettingsView {
  fields: DetectionFieldView[];
  styles: StyleSettingsView[];
}
