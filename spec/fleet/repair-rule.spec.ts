import { DEFAULT_REPAIR_RULE, type ApplianceLife } from '../../shared/api/appliances';
import { repairOrReplace, repairsInLastYear } from '../../server/services/repair-rule';

/**
 * The repair-or-replace rule of thumb: past half its expected life, replace when a repair
 * costs half a new unit or more (common practice, no published source; both shares are a setting).
 * Expected lives are NAHB / Bank of America Home Equity (2007): refrigerator 13 years.
 */
const NOW_MS = Date.parse('2026-03-02T15:00:00Z');

function life(ageYears: number | null): ApplianceLife {
  return { lifeClass: 'refrigerator', expectedYears: 13, ageYears, lifeFraction: ageYears === null ? null : ageYears / 13, source: 'spec' };
}

describe('repair-or-replace rule of thumb', () => {
  it('says repair before mid-life, whatever the repair history', () => {
    const hint = repairOrReplace(life(6.4), DEFAULT_REPAIR_RULE, null, NOW_MS);
    expect(hint.verdict).toBe('repair');
    expect(hint.summary).toContain('6.4 of about 13 years');
  });

  it('says weigh the quote at mid-life and beyond, with the threshold as a share when no new-unit price is set', () => {
    const hint = repairOrReplace(life(6.5), DEFAULT_REPAIR_RULE, null, NOW_MS);
    expect(hint.verdict).toBe('weigh');
    expect(hint.replaceAtCents).toBeNull();
    expect(hint.summary).toContain('half the price of a new unit');
    expect(repairOrReplace(life(14), DEFAULT_REPAIR_RULE, null, NOW_MS).summary).toMatch(/^Past its expected life/);
  });

  it('follows the setting: a lower life share moves the threshold earlier', () => {
    const rule = { ...DEFAULT_REPAIR_RULE, pastLifeShare: 0.25, repairShareOfNewPrice: 0.4, newUnitPriceCents: { refrigerator: 100_000 } };
    const hint = repairOrReplace(life(4), rule, null, NOW_MS);
    expect(hint.verdict).toBe('weigh');
    expect(hint.replaceAtCents).toBe(40_000);
    expect(hint.summary).toContain('40 %');
  });

  it('cannot judge without an install date', () => {
    expect(repairOrReplace(life(null), DEFAULT_REPAIR_RULE, null, NOW_MS).verdict).toBe('unknown');
  });

  it('counts only completed repairs of the last twelve months', () => {
    const entry = (completedAt: string | null, totalCents: number) => ({ workOrderId: completedAt ?? 'open', state: 'completed', contractorName: '', dispatchedAt: '2026-01-01T00:00:00Z', completedAt, causeFound: null, findings: '', parts: [], labourMinutes: 0, totalCents, currency: 'USD' });
    expect(repairsInLastYear([entry('2026-02-01T00:00:00Z', 100), entry('2025-03-10T00:00:00Z', 20), entry('2025-02-01T00:00:00Z', 5_000), entry(null, 7_000)], NOW_MS)).toBe(120);
  });
});
