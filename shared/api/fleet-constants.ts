/**
 * Values of the fleet overview and the appliance page that the web client needs at run
 * time: plain constants and functions without zod, so the client bundle carries no schema
 * library. The request schemas and response types live in fleet.ts and appliances.ts.
 */
import type { ApplianceStyle, Health } from '../domain';

/** The classes the published service-life figures are given for. */
export type LifeClass = 'refrigerator' | 'freezer' | 'compact-refrigerator';

/**
 * Expected service life in years: refrigerator 13, freezer 11, compact refrigerator 9
 * (NAHB / Bank of America Home Equity, "Study of Life Expectancy of Home Components", 2007).
 */
export const EXPECTED_SERVICE_LIFE_YEARS: Readonly<Record<LifeClass, number>> = {
  refrigerator: 13,
  freezer: 11,
  'compact-refrigerator': 9,
};

export const SERVICE_LIFE_SOURCE = 'NAHB / Bank of America Home Equity, Study of Life Expectancy of Home Components (2007)';

/**
 * The life class of a style. The styles of the design brief say nothing about size, so no
 * style maps to the compact class yet; an inventory size field would select it.
 */
export function lifeClassOf(style: ApplianceStyle): LifeClass {
  return style === 'upright-freezer' || style === 'chest-freezer' ? 'freezer' : 'refrigerator';
}

export function expectedLifeYears(style: ApplianceStyle): number {
  return EXPECTED_SERVICE_LIFE_YEARS[lifeClassOf(style)];
}

const YEAR_MS = 365.2425 * 86_400_000;

/** Age in years (one decimal) from an install date (YYYY-MM-DD) to `nowMs`; null when unknown. */
export function ageYears(installedOn: string | null, nowMs: number): number | null {
  if (!installedOn) return null;
  const installedMs = Date.parse(`${installedOn}T00:00:00Z`);
  if (!Number.isFinite(installedMs)) return null;
  return Math.max(0, Math.round(((nowMs - installedMs) / YEAR_MS) * 10) / 10);
}

/** Age filters of the fleet overview. `past-life` is beyond the style's expected service life. */
export const AGE_BANDS = ['under-5', '5-to-10', 'over-10', 'past-life', 'unknown'] as const;
export type AgeBand = (typeof AGE_BANDS)[number];

export const AGE_BAND_LABELS: Readonly<Record<AgeBand, string>> = {
  'under-5': 'Under 5 years',
  '5-to-10': '5 to 10 years',
  'over-10': 'Over 10 years',
  'past-life': 'Past expected life',
  unknown: 'Install date unknown',
};

export type HealthCounts = Record<Health, number>;

export function emptyHealthCounts(): HealthCounts {
  return { cold: 0, drifting: 0, warm: 0, 'no-cooling': 0, silent: 0 };
}

/**
 * How urgent a health word is, for "worst first" ordering: no cooling, warm, a silent
 * sensor (nobody knows), drifting, cold. Our own ordering (common practice).
 */
export const HEALTH_URGENCY: Readonly<Record<Health, number>> = { 'no-cooling': 4, warm: 3, silent: 2, drifting: 1, cold: 0 };

/** The worst of several health words (a unit with two appliances shows its worst). */
export function worstHealth(healths: readonly Health[]): Health {
  return healths.reduce<Health>((worst, health) => (HEALTH_URGENCY[health] > HEALTH_URGENCY[worst] ? health : worst), 'cold');
}
