/**
 * A closed appliance without power against the USDA's holding times.
 */
import { ApplianceSimulator, defaultProfile } from '../../simulator/model';
import type { ApplianceProfile } from '../../simulator/model';
import { CLOSED_FRIDGE_SAFE_HOURS, FULL_FREEZER_SAFE_HOURS, HALF_FREEZER_SAFE_HOURS } from '../../shared/temperature';
import { HOUR_MS, MINUTE_MS, START_MS, median } from './trace-stats';

interface OutageTimes {
  /** Hours until the fresh-food probe first reads above 4 °C. */
  freshReadingH: number;
  /** Hours until the fresh food itself (ground truth) passes 4 °C. */
  freshFoodH: number;
  /** Hours until the freezer's food has thawed through (ground truth above −0.5 °C). */
  freezerThawedH: number;
}

function outage(profile: ApplianceProfile, seed: number, maxHours: number): OutageTimes {
  const sim = new ApplianceSimulator(profile, { seed, startMs: START_MS - 24 * HOUR_MS, faults: [{ fault: 'power-loss', startMs: START_MS }] });
  const times: OutageTimes = { freshReadingH: Infinity, freshFoodH: Infinity, freezerThawedH: Infinity };
  for (let atMs = START_MS; atMs <= START_MS + maxHours * HOUR_MS; atMs += 5 * MINUTE_MS) {
    sim.advanceTo(atMs);
    const hours = (atMs - START_MS) / HOUR_MS;
    const truth = sim.truth();
    const reading = sim.sample()?.freshFoodC ?? null;
    if (reading !== null && reading > 4) times.freshReadingH = Math.min(times.freshReadingH, hours);
    if (truth.freshFoodC > 4) times.freshFoodH = Math.min(times.freshFoodH, hours);
    if (truth.freezerFoodC > -0.5) times.freezerThawedH = Math.min(times.freezerThawedH, hours);
  }
  return times;
}

describe('simulator: power loss with the doors closed', () => {
  const closedDoors = { ...defaultProfile('top-freezer'), doorOpeningsPerDay: 0 };
  const seeds = [1, 2, 3, 4, 5];
  const fridgeTimes = seeds.map((seed) => outage(closedDoors, seed, 12));

  it('lets the fresh food pass 4 °C after roughly 4 hours', () => {
    // USDA FSIS, "Keeping Food Safe During an Emergency": a closed refrigerator keeps food safe
    // for about 4 hours. Loose check: the food crosses 4 °C between 2 and 7 h.
    const foodH = median(fridgeTimes.map((t) => t.freshFoodH));
    expect(foodH).toBeGreaterThan(2);
    expect(foodH).toBeLessThan(7);
    expect(Math.abs(foodH - CLOSED_FRIDGE_SAFE_HOURS)).toBeLessThan(2);
  });

  it('shows the probe (cabinet air) crossing 4 °C before the food does, but not at once', () => {
    // The air warms ahead of the food it surrounds; still a closed cabinet takes at least an hour.
    for (const t of fridgeTimes) {
      expect(t.freshReadingH).toBeGreaterThan(1);
      expect(t.freshReadingH).toBeLessThan(7);
      expect(t.freshReadingH).toBeLessThanOrEqual(t.freshFoodH);
    }
  });

  it('keeps a full freezer frozen for about two days and a half-full one for about one', () => {
    // USDA FSIS, same page: a full freezer holds about 48 h, a half-full one about 24 h.
    // Loose check on when the food has thawed through.
    const full = { ...defaultProfile('upright-freezer'), doorOpeningsPerDay: 0 };
    const half = { ...full, freezerContentsJPerK: full.freezerContentsJPerK / 2 };
    const fullH = outage(full, 1, 150).freezerThawedH;
    const halfH = outage(half, 1, 150).freezerThawedH;
    expect(fullH).toBeGreaterThan(FULL_FREEZER_SAFE_HOURS * 0.75);
    expect(fullH).toBeLessThan(FULL_FREEZER_SAFE_HOURS * 2.5);
    expect(halfH).toBeGreaterThan(HALF_FREEZER_SAFE_HOURS * 0.75);
    expect(halfH).toBeLessThan(HALF_FREEZER_SAFE_HOURS * 2.5);
    expect(fullH).toBeGreaterThan(1.5 * halfH);
  });
});
