import fs from 'node:fs';
import { SCHEMA_FILE, payloadSchemaText } from '../../broker/write-payload-schema';
import { fnv1a32, parseReadingTopic, readingPayloadSchema, readingTopic, SHARD_COUNT, shardFilter, shardOf } from '../../shared/telemetry';

describe('telemetry contract: topics and payload schema', () => {
  it('keeps the committed JSON Schema equal to the one generated from the zod schema', () => {
    // Regenerate with: npx tsx --tsconfig server/tsconfig.json broker/write-payload-schema.ts
    expect(fs.readFileSync(SCHEMA_FILE, 'utf8')).toBe(payloadSchemaText());
  });

  it('describes every payload field in the JSON Schema', () => {
    const schema = JSON.parse(fs.readFileSync(SCHEMA_FILE, 'utf8'));
    expect(Object.keys(schema.properties).sort()).toEqual(['at', 'battery_v', 'door', 'freezer', 'fresh_food', 'sensor', 'seq']);
    expect(schema.required.sort()).toEqual(['at', 'sensor', 'seq']);
  });

  // FNV-1a 32-bit check values from the FNV test vectors (draft-eastlake-fnv): "" → 811c9dc5, "a" → e40c292c, "foobar" → bf9cf968.
  it('hashes device ids with FNV-1a as published', () => {
    expect(fnv1a32('')).toBe(0x811c9dc5);
    expect(fnv1a32('a')).toBe(0xe40c292c);
    expect(fnv1a32('foobar')).toBe(0xbf9cf968);
  });

  it('puts each device in one shard and its topic under that shard', () => {
    const topic = readingTopic('cw-0123456789ab');
    expect(topic).toBe(`cw/v1/s/${shardOf('cw-0123456789ab')}/cw-0123456789ab/reading`);
    expect(parseReadingTopic(topic)).toEqual({ shard: shardOf('cw-0123456789ab'), deviceId: 'cw-0123456789ab' });
    expect(shardFilter(7)).toBe('cw/v1/s/7/+/reading');
  });

  it('spreads device ids over all shards roughly evenly', () => {
    const perShard = new Array<number>(SHARD_COUNT).fill(0);
    for (let i = 0; i < 6400; i++) perShard[shardOf(`cw-${i.toString(16).padStart(12, '0')}`)]++;
    expect(Math.min(...perShard)).toBeGreaterThan(50);
    expect(Math.max(...perShard)).toBeLessThan(150);
  });

  it('refuses topics that are not reading topics or name the wrong shard', () => {
    const wrongShard = (shardOf('cw-0123456789ab') + 1) % SHARD_COUNT;
    for (const topic of [`cw/v1/s/${wrongShard}/cw-0123456789ab/reading`, 'cw/v1/s/01/cw-0123456789ab/reading', 'cw/v1/s/x/cw-0123456789ab/reading', 'cw/v2/s/1/a/reading', 'cw/v1/s/1/+/reading', 'anything']) {
      expect(parseReadingTopic(topic)).withContext(topic).toBeNull();
    }
  });

  it('accepts a reading with one probe, and refuses one with none', () => {
    const base = { sensor: 'cw-0123456789ab', seq: 0, at: '2026-01-05T10:00:00Z' };
    expect(readingPayloadSchema.safeParse({ ...base, freezer: -18.5 }).success).toBeTrue();
    expect(readingPayloadSchema.safeParse({ ...base, fresh_food: null, door: 'open', battery_v: 3.01 }).success).toBeTrue();
    expect(readingPayloadSchema.safeParse(base).success).toBeFalse();
  });
});
