import { foodSafetyGuidance, formatDuration } from '../../server/work-orders/food-safety';

describe("the tenant's food-safety guidance", () => {
  it('names the USDA FSIS pages it follows and defers to the local health authority', () => {
    const sources = foodSafetyGuidance('warm', 30).sources.join(' ');
    expect(sources).toContain('Keep Your Food Safe During Emergencies');
    expect(sources).toContain('Refrigeration and Food Safety');
    expect(sources).toContain('local health authority');
  });

  it('says how long the fresh-food section has been above 40 °F', () => {
    const guidance = foodSafetyGuidance('warm', 95);
    expect(guidance.atRisk).toBeTrue();
    expect(guidance.minutesAbove4c).toBe(95);
    expect(guidance.headline).toContain('1 hour 35 minutes');
    expect(formatDuration(1)).toBe('1 minute');
  });

  it('says what to keep and what to throw away after 2 hours above 40 °F, and how long a closed freezer holds', () => {
    const advice = foodSafetyGuidance('no-cooling', 150).advice.join(' ');
    // USDA FSIS, "Danger Zone (40 °F – 140 °F)": perishables above 40 °F for more than 2 hours go.
    expect(advice).toContain('for more than 2 hours');
    expect(advice).toMatch(/Hard cheeses, butter, whole fruit/);
    // USDA FSIS, "Keep Your Food Safe During Emergencies": full freezer about 48 h, half full about 24 h, if closed.
    expect(advice).toContain('a full freezer about 48 hours (about 24 hours half full)');
    // U.S. FDA, "Refrigerator Thermometers: Cold Facts about Food Safety": 40 °F fridge, 0 °F freezer.
    expect(advice).toContain('40 °F (4 °C) or below, the freezer at 0 °F (−18 °C) or below');
  });

  it('asks for a thermometer check when the sensor is silent, without discard advice', () => {
    const silent = foodSafetyGuidance('silent', 0);
    expect(silent.atRisk).toBeFalse();
    expect(silent.advice.join(' ')).toContain('thermometer');
    expect(silent.advice.join(' ')).not.toContain('Throw away');
  });
});
