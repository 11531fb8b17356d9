import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { SensorRejectsView } from '../../../shared/api/telemetry';
import { SensorDetail } from './sensor-detail';
import { configureSpec, sensor, settle } from './testing';

const REFUSED: SensorRejectsView = {
  sensorId: 's1',
  deviceId: 'cw-000000000001',
  countsByReason: { 'wrong-secret': 2, schema: 5, 'sensor-error-value': 1 },
  latest: [
    { at: '2026-03-02T10:00:00.000Z', source: 'ingest', reason: 'schema', detail: 'fresh_food: expected number', payloadExcerpt: '{"sensor":"cw-000000000001","fresh_food":"cold"}' },
    { at: '2026-03-02T09:00:00.000Z', source: 'broker', reason: 'wrong-secret', detail: 'sign-in refused', payloadExcerpt: null },
  ],
};

describe('SensorDetail', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  async function render(rejects: SensorRejectsView, lastSeenAt: string | null, lastHeardAt: string | null = null) {
    const fixture = TestBed.createComponent(SensorDetail);
    fixture.componentRef.setInput('sensorId', 's1');
    fixture.detectChanges();
    await settle(fixture);
    backend.expectOne('/api/inventory/sensors/s1').flush(sensor(1, { lastSeenAt, lastHeardAt }));
    backend.expectOne('/api/sensors/s1/rejects').flush(rejects);
    await settle(fixture);
    return { fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('shows where the sensor is, and what was refused of it, most frequent reason first', async () => {
    const { element } = await render(REFUSED, new Date().toISOString());
    expect(element.querySelector('h2')?.textContent).toContain('cw-000000000001');
    expect(element.querySelector('.place a')?.getAttribute('href')).toBe('/appliances/a1');
    expect(element.querySelector('[data-testid="liveness"]')?.textContent).toContain('Last heard');
    expect(element.querySelector('[data-testid="reading-time"]')).toBeNull();
    const counts = Array.from(element.querySelectorAll('.counts li')).map((item) => `${item.querySelector('.count')?.textContent} ${item.querySelector('.count + span')?.textContent?.trim()}`);
    expect(counts).toEqual([
      '5 schema — payload does not match the reading schema',
      '2 wrong-secret — sign-in with a wrong secret',
      '1 sensor-error-value — probe reported a known error value (−127 or 85 °C), stored as a flag',
    ]);
    const latest = Array.from(element.querySelectorAll('.latest li'));
    expect(latest.map((item) => item.querySelector('.source')?.textContent)).toEqual(['Ingest', 'Broker']);
    expect(latest.map((item) => item.querySelector('.reason')?.textContent)).toEqual(['schema', 'wrong-secret']);
    expect(latest[0].querySelector('.excerpt')?.textContent).toContain('"fresh_food":"cold"');
    expect(latest[1].querySelector('.excerpt')).toBeNull();
  });

  it('says so when nothing was refused, and calls a sensor silent after three intervals without a report', async () => {
    const longAgo = new Date(Date.now() - 16 * 60_000).toISOString();
    const { element } = await render({ sensorId: 's1', deviceId: 'cw-000000000001', countsByReason: {}, latest: [] }, longAgo);
    expect(element.textContent).toContain('Nothing refused or flagged from this sensor');
    expect(element.querySelector('.latest')).toBeNull();
    const liveness = element.querySelector('[data-testid="liveness"]');
    expect(liveness?.textContent).toContain('Silent: last heard');
    expect(liveness?.classList).toContain('is-silent');
  });

  it('judges liveness by arrival: a sensor sending hours-old readings now is heard, and says how old its newest reading is', async () => {
    const hoursAgo = new Date(Date.now() - 5 * 3_600_000).toISOString();
    const { element } = await render({ sensorId: 's1', deviceId: 'cw-000000000001', countsByReason: {}, latest: [] }, hoursAgo, new Date().toISOString());
    const liveness = element.querySelector('[data-testid="liveness"]');
    expect(liveness?.textContent).toContain('Last heard');
    expect(liveness?.classList).not.toContain('is-silent');
    expect(element.querySelector('[data-testid="reading-time"]')?.textContent).toContain('Newest reading taken');
  });

  it('says why the page could not load', async () => {
    const fixture = TestBed.createComponent(SensorDetail);
    fixture.componentRef.setInput('sensorId', 's1');
    fixture.detectChanges();
    await settle(fixture);
    backend.expectOne('/api/inventory/sensors/s1').flush({ error: 'no such sensor' }, { status: 404, statusText: 'Not Found' });
    backend.match('/api/sensors/s1/rejects');
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('No such sensor');
  });
});
