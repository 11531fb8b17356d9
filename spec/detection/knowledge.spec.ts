import { CAUSES, SAFETY_CAUTIONS } from '../../shared/causes';
import { CAUSE_CODES } from '../../shared/domain';
import { possibleCauses } from '../../server/detection/diagnosis';
import { DEFAULT_SETTINGS, SETTING_DOCS, settingsFor } from '../../server/detection/settings';

describe('cause knowledge base', () => {
  it('describes every cause code with a title, a signature, and checks', () => {
    for (const code of CAUSE_CODES) {
      const info = CAUSES[code];
      expect(info.code).toBe(code);
      expect(info.title.length).withContext(code).toBeGreaterThan(5);
      expect(info.signature.length).withContext(code).toBeGreaterThan(20);
      expect(info.checks.length).withContext(code).toBeGreaterThan(0);
    }
  });

  it('tells a technician to bring parts for every repair cause, and sends nobody for power or the sensor', () => {
    for (const code of CAUSE_CODES) {
      const info = CAUSES[code];
      if (code === 'power-loss' || code === 'sensor') expect(info.dispatch).withContext(code).toBeFalse();
      else expect(info.parts.length).withContext(code).toBeGreaterThan(0);
    }
  });

  it('carries the evaporator-fan checks of the trade (common practice): spins freely, line voltage, hum without spin', () => {
    const checks = CAUSES['evaporator-fan'].checks.join(' ');
    expect(checks).toMatch(/spin freely/);
    expect(checks).toMatch(/120 V AC/);
    expect(checks).toMatch(/hums or twitches but does not spin/);
  });

  it('shows the cautions of the design brief', () => {
    const cautions = SAFETY_CAUTIONS.join(' ');
    expect(cautions).toMatch(/Disconnect power/);
    expect(cautions).toMatch(/meter/);
    expect(cautions).toMatch(/EPA Section 608 Type I or Universal/);
    expect(cautions).toMatch(/local (health authority|law)/);
    expect(CAUSES['compressor-start'].sealedSystemPossible).toBeTrue();
  });

  it('offers only the causes a style can have (a chest freezer has no fan, damper or automatic defrost)', () => {
    expect(possibleCauses('chest-freezer')).not.toContain('evaporator-fan');
    expect(possibleCauses('chest-freezer')).not.toContain('air-damper');
    expect(possibleCauses('upright-freezer')).not.toContain('air-damper');
    expect(possibleCauses('top-freezer').length).toBe(7);
  });
});

describe('settings', () => {
  it('documents every setting with its unit and reason', () => {
    for (const [key, doc] of Object.entries(SETTING_DOCS)) {
      expect(doc.reason.length).withContext(key).toBeGreaterThan(10);
      expect(doc.unit.length).withContext(key).toBeGreaterThan(0);
      expect((DEFAULT_SETTINGS as unknown as Record<string, unknown>)[key]).withContext(key).toEqual(doc.value);
    }
  });

  it('lets managers override per style and then per appliance', () => {
    const merged = settingsFor('top-freezer', { freshOverTempGraceMinutes: 45 }, { freshOverTempGraceMinutes: 30, stuckMinutes: 300 });
    expect(merged.freshOverTempGraceMinutes).toBe(30);
    expect(merged.stuckMinutes).toBe(300);
    expect(DEFAULT_SETTINGS.freshOverTempGraceMinutes).toBe(60);
  });
});
