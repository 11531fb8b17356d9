import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cToF } from '../../shared/temperature';
import { signal, simulate } from './support/traces';

const ROOT = join(__dirname, '..', '..');

function analyze(...args: string[]) {
  return spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'server', 'cli', 'analyze.ts'), ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, TSX_TSCONFIG_PATH: join(ROOT, 'server', 'tsconfig.json') },
  });
}

describe('analyze CLI (DESIGN.md logger-file contract)', () => {
  let dir: string;
  beforeAll(() => (dir = mkdtempSync(join(tmpdir(), 'analyze-'))));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('prints one JSON document with the findings of a logger file in °F, unsorted, with blanks', () => {
    const readings = simulate({ style: 'top-freezer', days: 3, fault: 'compressor-start', onsetHours: 30, intervalMinutes: 10 });
    const rows = readings.map((r, i) => `${i % 7 === 0 ? r.atMs : new Date(r.atMs).toISOString()},${i % 50 === 3 ? '' : cToF(r.freshFoodC!).toFixed(2)},${cToF(r.freezerC!).toFixed(2)}`);
    const shuffled = [...rows.slice(100), ...rows.slice(0, 100), rows[5]];
    const file = join(dir, 'logger.csv');
    writeFileSync(file, `timestamp,fresh_food_f,freezer_f\n${shuffled.join('\n')}\n`);
    const result = analyze(file, '--style', 'top-freezer');
    expect(result.status).toBe(0);
    expect(result.stdout.trim().split('\n').length).toBe(1);
    const document = JSON.parse(result.stdout);
    expect(document.summary.readings).toBe(readings.length);
    expect(document.summary.file.duplicates_merged).toBe(1);
    const kinds = document.findings.map((f: { kind: string }) => f.kind);
    expect(kinds).toContain('no-cooling');
    const first = document.findings[0];
    expect(Object.keys(first)).toEqual(jasmine.arrayContaining(['kind', 'compartment', 'started_at', 'detected_at', 'ended_at', 'severity', 'probable_causes', 'minutes_above_4c']));
    expect(first.detected_at).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    expect(first.probable_causes[0]).toEqual({ code: jasmine.any(String), confidence: jasmine.any(Number) });
  });

  it('infers the style from the columns when none is given', () => {
    const file = join(dir, 'fresh.csv');
    const rows = signal({ hours: 30, freezerC: null }).map((r) => `${new Date(r.atMs).toISOString()},${r.freshFoodC}`);
    writeFileSync(file, `timestamp,fresh_food_c\n${rows.join('\n')}\n`);
    const document = JSON.parse(analyze(file).stdout);
    expect(document.summary.style).toBe('fresh-food-only');
    expect(document.findings).toEqual([]);
  });

  it('exits non-zero with a one-line message for a file it cannot read', () => {
    const missing = analyze(join(dir, 'nope.csv'));
    expect(missing.status).not.toBe(0);
    expect(missing.stdout).toBe('');
    expect(missing.stderr.trim().split('\n').length).toBe(1);
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'when,what\n1,2\n');
    const unreadable = analyze(bad);
    expect(unreadable.status).toBe(1);
    expect(unreadable.stderr).toMatch(/timestamp/);
  });
});
