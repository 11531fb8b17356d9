/**
 * The repair-or-replace rule of thumb (common practice, no published source; a setting):
 * past a share of its expected life (default half), replace an appliance when a repair
 * costs at least a share (default half) of a comparable new unit.
 */
import type { ApplianceLife, RepairOrReplaceHint, RepairRuleSettings, ServiceHistoryEntry } from '../../shared/api/appliances';

const YEAR_MS = 365.2425 * 86_400_000;

function money(cents: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency, maximumFractionDigits: 0 }).format(cents / 100);
}

function share(fraction: number): string {
  return fraction === 0.5 ? 'half' : `${Math.round(fraction * 100)} %`;
}

/** Repair spend on completed work orders in the twelve months before `nowMs`. */
export function repairsInLastYear(history: readonly ServiceHistoryEntry[] | null, nowMs: number): number {
  if (!history) return 0;
  return history
    .filter((entry) => entry.completedAt !== null && nowMs - Date.parse(entry.completedAt) <= YEAR_MS)
    .reduce((sum, entry) => sum + entry.totalCents, 0);
}

function ageWords(life: ApplianceLife): string {
  return `${life.ageYears?.toFixed(1)} of about ${life.expectedYears} years`;
}

export function repairOrReplace(life: ApplianceLife, rule: RepairRuleSettings, history: readonly ServiceHistoryEntry[] | null, nowMs: number): RepairOrReplaceHint {
  const repairsLastYearCents = repairsInLastYear(history, nowMs);
  const price = rule.newUnitPriceCents[life.lifeClass] ?? null;
  const replaceAtCents = price === null ? null : Math.round(price * rule.repairShareOfNewPrice);
  const base = { replaceAtCents, repairsLastYearCents, currency: rule.currency, rule };
  if (life.lifeFraction === null) {
    return { ...base, verdict: 'unknown', summary: 'The install date is unknown, so the rule of thumb cannot weigh this appliance’s age.' };
  }
  if (life.lifeFraction < rule.pastLifeShare) {
    return { ...base, verdict: 'repair', summary: `At ${ageWords(life)}, a repair is usually worth it.` };
  }
  const stage = life.lifeFraction >= 1 ? 'Past its expected life' : `Past ${share(rule.pastLifeShare)} of its expected life`;
  if (replaceAtCents !== null && repairsLastYearCents >= replaceAtCents) {
    return {
      ...base,
      verdict: 'replace',
      summary: `${stage} (${ageWords(life)}), and repairs in the last 12 months (${money(repairsLastYearCents, rule.currency)}) reached ${share(rule.repairShareOfNewPrice)} the price of a new unit: replace it.`,
    };
  }
  const threshold = replaceAtCents === null ? `${share(rule.repairShareOfNewPrice)} the price of a new unit` : `${money(replaceAtCents, rule.currency)} (${share(rule.repairShareOfNewPrice)} the price of a new unit)`;
  return { ...base, verdict: 'weigh', summary: `${stage} (${ageWords(life)}): replace rather than repair if the repair would cost ${threshold} or more.` };
}
