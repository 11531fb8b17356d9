import { validateMessage, type ValidationLimits } from '../../server/ingest/validate';
import { readingTopic } from '../../shared/telemetry';

const DEVICE = 'cw-0123456789ab';
const NOW_MS = Date.parse('2026-03-01T12:00:00Z');
const LIMITS: ValidationLimits = { nowMs: NOW_MS, oldestAcceptedMs: NOW_MS - 400 * 86_400_000, maxFutureSkewMs: 300_000 };
const good = { sensor: DEVICE, seq: 41, at: '2026-03-01T11:59:00Z', fresh_food: 3.25, freezer: -18.5, battery_v: 3.02, door: 'closed' };
const json = (value: unknown) => Buffer.from(JSON.stringify(value));

describe('ingest: validating one message', () => {
  it('turns a good payload into a reading', () => {
    const verdict = validateMessage(readingTopic(DEVICE), json(good), LIMITS);
    expect(verdict).toEqual({
      ok: true,
      notes: [],
      reading: { deviceId: DEVICE, seq: 41, atMs: Date.parse(good.at), freshFoodC: 3.25, freezerC: -18.5, freshFoodFlag: null, freezerFlag: null, batteryV: 3.02, doorOpen: false },
    });
  });

  const rejected: [string, string, Buffer, string][] = [
    ['not JSON', readingTopic(DEVICE), Buffer.from('fresh=3.2'), 'not-json'],
    ['a bare NaN (not valid JSON)', readingTopic(DEVICE), Buffer.from('{"sensor":"cw-0123456789ab","seq":1,"at":"2026-03-01T11:59:00Z","fresh_food":NaN}'), 'not-json'],
    ['binary garbage', readingTopic(DEVICE), Buffer.from([0xff, 0xfe, 0x00, 0x01]), 'not-json'],
    ['"NaN" as a string', readingTopic(DEVICE), json({ ...good, fresh_food: 'NaN' }), 'schema'],
    ['a temperature as text', readingTopic(DEVICE), json({ ...good, freezer: '-18' }), 'schema'],
    ['a fractional sequence number', readingTopic(DEVICE), json({ ...good, seq: 1.5 }), 'schema'],
    ['a time without offset', readingTopic(DEVICE), json({ ...good, at: '2026-03-01 11:59' }), 'schema'],
    ['no sensor id', readingTopic(DEVICE), json({ ...good, sensor: undefined }), 'schema'],
    ['no probe at all', readingTopic(DEVICE), json({ sensor: DEVICE, seq: 1, at: good.at }), 'schema'],
    ['a JSON array', readingTopic(DEVICE), json([good]), 'schema'],
    ['another sensor’s id in the payload', readingTopic(DEVICE), json({ ...good, sensor: 'cw-ffffffffffff' }), 'topic-mismatch'],
    ['a payload of 20 kB', readingTopic(DEVICE), json({ ...good, padding: 'x'.repeat(20_000) }), 'too-large'],
    ['70 °C', readingTopic(DEVICE), json({ ...good, fresh_food: 70 }), 'out-of-range'],
    ['−60.5 °C', readingTopic(DEVICE), json({ ...good, freezer: -60.5 }), 'out-of-range'],
    ['a time an hour ahead', readingTopic(DEVICE), json({ ...good, at: '2026-03-01T13:00:00Z' }), 'future-timestamp'],
    ['a time older than the retention', readingTopic(DEVICE), json({ ...good, at: '2024-01-01T00:00:00Z' }), 'too-old'],
    ['a topic of the wrong shard', readingTopic(DEVICE).replace(/\/s\/\d+\//, '/s/999/'), json(good), 'bad-topic'],
  ];

  for (const [what, topic, payload, reason] of rejected) {
    it(`rejects ${what} as ${reason}`, () => {
      const verdict = validateMessage(topic, payload, LIMITS);
      expect(verdict.ok).toBeFalse();
      if (!verdict.ok) expect(verdict.reason).toBe(reason);
    });
  }

  // 85 °C: DS18B20 power-on reset value (Maxim DS18B20 datasheet); −127 °C: disconnected probe in common 1-Wire drivers (common practice).
  it('keeps a reading whose probe reports a known error value, as a flag and a counted note', () => {
    const verdict = validateMessage(readingTopic(DEVICE), json({ ...good, fresh_food: -127, freezer: 85 }), LIMITS);
    expect(verdict.ok).toBeTrue();
    if (!verdict.ok) return;
    expect(verdict.reading).toEqual(jasmine.objectContaining({ freshFoodC: null, freshFoodFlag: 'disconnected', freezerC: null, freezerFlag: 'power-on' }));
    expect(verdict.notes.map((note) => note.reason)).toEqual(['sensor-error-value', 'sensor-error-value']);
  });

  it('rounds values to 0.0001 °C, far below any probe resolution', () => {
    const verdict = validateMessage(readingTopic(DEVICE), json({ ...good, fresh_food: 3.123456, freezer: 1e-50 }), LIMITS);
    expect(verdict.ok && [verdict.reading.freshFoodC, verdict.reading.freezerC]).toEqual([3.1235, 0]);
  });

  it('accepts the edges of the plausible range', () => {
    expect(validateMessage(readingTopic(DEVICE), json({ ...good, fresh_food: 60, freezer: -60 }), LIMITS).ok).toBeTrue();
  });
});
