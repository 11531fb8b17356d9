import { DETECTION_SETTING_FIELDS, FIELD_BY_KEY } from '../../../shared/api/settings';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../../shared/temperature';
import { displayBounds, fromDisplay, toDisplay } from './setting-units';

describe('setting units', () => {
  const limit = FIELD_BY_KEY.freshFoodLimitC;
  const rise = FIELD_BY_KEY.freshMinRiseC;
  const grace = FIELD_BY_KEY.freshOverTempGraceMinutes;

  it('shows temperatures in °F with the offset and differences without it (NIST SP 811, B.8)', () => {
    // 40 °F = 4.444… °C: the U.S. FDA refrigerator limit.
    expect(toDisplay(limit, FRESH_FOOD_LIMIT_C, 'F')).toBe(40);
    expect(toDisplay(FIELD_BY_KEY.freezerLimitC, FREEZER_LIMIT_C, 'F')).toBe(0);
    // A rise of 1.5 °C is 2.7 °F: Δ°F = Δ°C × 9/5.
    expect(toDisplay(rise, 1.5, 'F')).toBe(2.7);
    expect(toDisplay(limit, FRESH_FOOD_LIMIT_C, 'C')).toBe(4.4);
    expect(toDisplay(grace, 60, 'F')).toBe(60);
  });

  it('converts back exactly, so 40 °F is the FDA limit and not a hair above it', () => {
    expect(fromDisplay(limit, 40, 'F')).toBe(FRESH_FOOD_LIMIT_C);
    expect(fromDisplay(rise, 2.7, 'F')).toBeCloseTo(1.5, 10);
    expect(fromDisplay(grace, 45, 'C')).toBe(45);
  });

  it('rounds bounds inwards so every value the form accepts passes the server', () => {
    for (const field of DETECTION_SETTING_FIELDS) {
      for (const unit of ['C', 'F'] as const) {
        const { min, max } = displayBounds(field, unit);
        expect(fromDisplay(field, max, unit)).withContext(`${field.key} max in °${unit}`).toBeLessThanOrEqual(field.max + 1e-9);
        expect(fromDisplay(field, min, unit)).withContext(`${field.key} min in °${unit}`).toBeGreaterThanOrEqual(field.min - 1e-9);
      }
    }
    expect(displayBounds(limit, 'F').max).toBe(40);
    expect(displayBounds(limit, 'C').max).toBe(4.4);
  });
});
