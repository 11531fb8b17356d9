import pino from 'pino';
import request from 'supertest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { HealthService, databaseProbe, probe } from '../../server/services/health';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

describe('GET /api/health', () => {
  let db: TestDatabase;
  let brokerUp = true;
  let ingestUp: boolean | null = null;

  const appWith = () =>
    createApp({
      config: { ...loadConfig({ NODE_ENV: 'test' }), clientDir: '/nonexistent' },
      dataSource: db.dataSource,
      logger: pino({ level: 'silent' }),
      brokerProbe: () => probe(async () => {
        if (!brokerUp) throw new Error('connection refused');
        return 'fake broker';
      }),
      ingestProbe: ingestUp === null ? undefined : async () => ({ state: ingestUp ? 'up' : 'down', latencyMs: null, detail: ingestUp ? '12 readings stored' : 'not connected to the broker' }),
      version: '9.9.9',
    });

  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(async () => db.drop());

  it('reports every component up when the database and the broker answer', async () => {
    brokerUp = true;
    const res = await request(appWith()).get('/api/health').expect(200);
    expect(res.body.status).toBe('ok');
    expect(res.body.version).toBe('9.9.9');
    expect(res.body.components.database.state).toBe('up');
    expect(res.body.components.broker.state).toBe('up');
  });

  it('tells anyone only the states; versions and error messages are for managers', async () => {
    brokerUp = false;
    const res = await request(appWith()).get('/api/health').expect(200);
    expect(res.body.status).toBe('degraded');
    expect(res.body.components.broker).toEqual({ state: 'down', latencyMs: null, detail: '' });
    expect(res.body.components.database).toEqual({ state: 'up', latencyMs: null, detail: '' });
    expect(JSON.stringify(res.body)).not.toContain('PostgreSQL');
    expect((await request(appWith()).get('/api/health/details').expect(401)).body.error).toBeDefined();
    brokerUp = true;
  });

  it('gives the details (what is running, why a component is down) in the full report', async () => {
    const health = new HealthService('9.9.9', { database: databaseProbe(db.dataSource), broker: () => probe(async () => { throw new Error('connection refused'); }) });
    const report = await health.report();
    expect(report.status).toBe('degraded');
    expect(report.components.database.detail).toMatch(/^PostgreSQL \d+/);
    expect(report.components.broker).toEqual({ state: 'down', latencyMs: null, detail: 'connection refused' });
    expect(report.components.server.detail).toContain(process.version);
  });

  it('answers the readiness check with 503 while a component is down and 200 when all are up', async () => {
    brokerUp = false;
    await request(appWith()).get('/api/health/ready').expect(503);
    brokerUp = true;
    await request(appWith()).get('/api/health/ready').expect(200);
  });

  it('leaves the ingest out when this process runs none, and counts it when it does', async () => {
    brokerUp = true;
    ingestUp = null;
    expect((await request(appWith()).get('/api/health').expect(200)).body.components.ingest).toBeUndefined();
    ingestUp = false;
    const res = await request(appWith()).get('/api/health').expect(200);
    expect(res.body.status).toBe('degraded');
    expect(res.body.components.ingest).toEqual({ state: 'down', latencyMs: null, detail: '' });
    await request(appWith()).get('/api/health/ready').expect(503);
    ingestUp = true;
    expect((await request(appWith()).get('/api/health').expect(200)).body.status).toBe('ok');
    ingestUp = null;
  });

  it('answers a JSON 404 for an unknown API path', async () => {
    const res = await request(appWith()).get('/api/no-such-thing').expect(404);
    expect(res.body.error).toBe('no such endpoint: GET /api/no-such-thing');
  });

  it('explains that the client is not built instead of failing on a client route', async () => {
    const res = await request(appWith()).get('/fleet').expect(503);
    expect(res.text).toContain('npm run build:client');
  });

  it('sends security headers', async () => {
    const res = await request(appWith()).get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
