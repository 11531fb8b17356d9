import type { Server } from 'node:http';
import pino from 'pino';
import type { Actor } from '../../server/auth/actor';
import { Scope, type Placement } from '../../server/auth/scope';
import { EventBus, type BusEvent } from '../../server/events/bus';
import { LiveEventsService } from '../../server/services/live-events';
import type { HealthChangedEvent, LiveEvent } from '../../shared/api/monitor';
import { SETUP_TIMEOUT_MS, createFleetWorld, passwordOf, type FleetWorld } from './support/fleet-world';
import { SseStream, listen, signInOverHttp } from './support/sse-client';

const silent = pino({ level: 'silent' });

function actor(role: Actor['role'], organizationId: string, unitId: string | null = null, id = `${role}-${organizationId}-${unitId}`): Actor {
  return { id, email: `${id}@example.com`, displayName: id, role, isAdmin: false, organizationId, unitId, temperatureUnit: 'F', timeZone: null };
}

function healthChanged(place: { organizationId: string; propertyId: string; unitId: string; applianceId: string }, health: HealthChangedEvent['health'] = 'warm'): HealthChangedEvent {
  return { type: 'appliance.health-changed', ...place, atMs: Date.parse('2026-03-02T15:00:00Z'), health, previous: 'cold' };
}

/** Scope as the work-order loop extends it: a contractor reaches the units of their open jobs. */
class ScopeWithJobs extends Scope {
  readonly jobs = new Map<string, Set<string>>();
  protected override async contractorReaches(actor: Actor, placement: Placement): Promise<boolean> {
    return this.jobs.get(actor.id)?.has(placement.unitId) ?? false;
  }
}

describe('live feed', () => {
  let world: FleetWorld;
  const ids: Record<string, string> = {};
  const place = (unit: 'unitA' | 'unitB' | 'unitC') => ({
    organizationId: unit === 'unitC' ? ids.org2 : ids.org1,
    propertyId: unit === 'unitC' ? ids.property2 : ids.property1,
    unitId: ids[unit],
    applianceId: ids[`appliance${unit.slice(-1)}`],
  });

  beforeAll(async () => {
    world = await createFleetWorld({ webApp: { heartbeatMs: 150 } });
    const { seed } = world;
    ids.org1 = await seed.organization('Harbor Flats (spec)');
    ids.org2 = await seed.organization('Elsewhere (spec)');
    ids.property1 = await seed.property(ids.org1, 'Birch Court');
    ids.property2 = await seed.property(ids.org2, 'Far Tower');
    ids.unitA = await seed.unit(ids.property1, '1A');
    ids.unitB = await seed.unit(ids.property1, '1B');
    ids.unitC = await seed.unit(ids.property2, '7C');
    ids.applianceA = await seed.appliance(ids.unitA);
    ids.applianceB = await seed.appliance(ids.unitB);
    ids.applianceC = await seed.appliance(ids.unitC);
  }, SETUP_TIMEOUT_MS);
  afterAll(async () => world.close(), SETUP_TIMEOUT_MS);

  describe('audience rules', () => {
    let bus: EventBus;
    let scope: ScopeWithJobs;
    let live: LiveEventsService;
    let received: Map<string, LiveEvent[]>;

    beforeEach(() => {
      bus = new EventBus();
      scope = new ScopeWithJobs(world.db.dataSource);
      live = new LiveEventsService({ bus, scope, logger: silent });
      received = new Map();
    });

    function listenAs(name: string, who: Actor): () => void {
      received.set(name, []);
      return live.subscribe(who, (event) => received.get(name)!.push(event));
    }

    const settle = () => new Promise((resolve) => setTimeout(resolve, 100));

    it('sends a manager their organization, a tenant their unit, and nobody another organization’s events', async () => {
      listenAs('manager1', actor('manager', ids.org1));
      listenAs('manager2', actor('manager', ids.org2));
      listenAs('tenantA', actor('tenant', ids.org1, ids.unitA));
      listenAs('tenantB', actor('tenant', ids.org1, ids.unitB));
      await bus.publish(healthChanged(place('unitA')));
      await bus.publish(healthChanged(place('unitC'), 'no-cooling'));
      await bus.publish({ type: 'incident.opened', ...place('unitB'), atMs: 1, incident: {} as never });
      await settle();
      expect(received.get('manager1')!.map((e) => [e.type, e.unitId])).toEqual([
        ['appliance.health-changed', ids.unitA],
        ['incident.opened', ids.unitB],
      ]);
      expect(received.get('manager2')!.map((e) => e.unitId)).toEqual([ids.unitC]);
      expect(received.get('tenantA')!.map((e) => e.unitId)).toEqual([ids.unitA]);
      expect(received.get('tenantB')!.map((e) => e.type)).toEqual(['incident.opened']);
    });

    it('keeps internal events (appliance.status) inside the server', async () => {
      listenAs('manager1', actor('manager', ids.org1));
      const status: BusEvent = { type: 'appliance.status', ...place('unitA'), applianceId: ids.applianceA, unitId: ids.unitA, lastReadingAtMs: 1, probes: {}, openRepairFindings: 0 };
      await bus.publish(status);
      await settle();
      expect(received.get('manager1')).toEqual([]);
    });

    it('sends a contractor only the units their jobs reach, in order, and a property-wide event to nobody of them', async () => {
      const contractor = actor('contractor', ids.org1, null, (await world.seed.person('contractor', ids.org1)).id);
      scope.jobs.set(contractor.id, new Set([ids.unitB]));
      listenAs('contractor', contractor);
      await bus.publish(healthChanged(place('unitA')));
      await bus.publish(healthChanged(place('unitB'), 'warm'));
      await bus.publish(healthChanged(place('unitB'), 'no-cooling'));
      await bus.publish({ type: 'service-request.changed', ...place('unitB'), unitId: null, applianceId: null, atMs: 1, serviceRequestId: 'x', status: 'open', change: 'opened' });
      await settle();
      expect(received.get('contractor')!.map((e) => [e.unitId, (e as HealthChangedEvent).health])).toEqual([
        [ids.unitB, 'warm'],
        [ids.unitB, 'no-cooling'],
      ]);
    });

    it('stops listening to the bus once the last subscriber leaves', async () => {
      const stopA = listenAs('a', actor('manager', ids.org1));
      const stopB = listenAs('b', actor('manager', ids.org1));
      stopA();
      await bus.publish(healthChanged(place('unitA')));
      expect(received.get('b')!.length).toBe(1);
      stopB();
      expect(live.connections).toBe(0);
      await bus.publish(healthChanged(place('unitA')));
      expect(received.get('b')!.length).toBe(1);
    });
  });

  describe('GET /api/events over HTTP', () => {
    let server: Server;
    let baseUrl: string;
    let managerEmail: string;
    const liveOf = () => world.app.locals.liveEvents as LiveEventsService;

    beforeAll(async () => {
      ({ server, baseUrl } = await listen(world.app));
      managerEmail = (await world.seed.person('manager', ids.org1)).email;
    });
    afterAll(async () => {
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
    });

    it('opens with a retry time and a hello, then streams the caller’s events with ids, and heartbeat comments', async () => {
      const { cookie } = await signInOverHttp(baseUrl, managerEmail, passwordOf(managerEmail));
      const stream = await SseStream.open(baseUrl, cookie);
      expect(stream.response.status).toBe(200);
      expect(stream.response.headers.get('content-type')).toContain('text/event-stream');
      await stream.waitFor((block) => (block.data as { type?: string })?.type === 'live.hello');
      expect(stream.blocks[0].retry).toBeGreaterThan(0);
      await world.bus.publish(healthChanged(place('unitC'), 'silent'));
      await world.bus.publish(healthChanged(place('unitA'), 'no-cooling'));
      const delivered = await stream.waitFor((block) => block.id !== null);
      expect(delivered.data).toEqual(jasmine.objectContaining({ type: 'appliance.health-changed', applianceId: ids.applianceA, health: 'no-cooling' }));
      expect(stream.events.some((event) => (event as LiveEvent).organizationId === ids.org2)).toBeFalse();
      await stream.waitFor((block) => block.comment?.startsWith('heartbeat') ?? false);
      stream.close();
    });

    it('ends the stream at the next heartbeat after sign-out, and a reconnect with a new session works', async () => {
      const { cookie, csrf } = await signInOverHttp(baseUrl, managerEmail, passwordOf(managerEmail));
      const stream = await SseStream.open(baseUrl, cookie);
      await stream.waitFor((block) => block.data !== undefined);
      expect((await fetch(`${baseUrl}/api/auth/sign-out`, { method: 'POST', headers: { cookie, 'x-xsrf-token': csrf } })).status).toBe(204);
      await stream.ended;
      // The old cookie now opens nothing; a fresh sign-in streams again.
      expect((await fetch(`${baseUrl}/api/events`, { headers: { cookie, accept: 'text/event-stream' } })).status).toBe(401);
      const again = await SseStream.open(baseUrl, (await signInOverHttp(baseUrl, managerEmail, passwordOf(managerEmail))).cookie);
      await again.waitFor((block) => block.data !== undefined);
      await world.bus.publish(healthChanged(place('unitB'), 'warm'));
      await again.waitFor((block) => (block.data as LiveEvent | undefined)?.unitId === ids.unitB);
      again.close();
    });

    it('ends the stream when the account is deactivated', async () => {
      const person = await world.seed.person('tenant', ids.org1, ids.unitA);
      const stream = await SseStream.open(baseUrl, (await signInOverHttp(baseUrl, person.email, passwordOf(person.email))).cookie);
      await stream.waitFor((block) => block.data !== undefined);
      await world.db.dataSource.query(`UPDATE app_user SET deactivated_at = now() WHERE id = $1`, [person.id]);
      await stream.ended;
    });

    async function connectionsSettleAt(count: number): Promise<void> {
      for (let i = 0; i < 80 && liveOf().connections !== count; i++) await new Promise((resolve) => setTimeout(resolve, 25));
      expect(liveOf().connections).toBe(count);
    }

    it('unsubscribes a stream the client closed', async () => {
      await connectionsSettleAt(0); // streams of earlier specs
      const before = 0;
      const stream = await SseStream.open(baseUrl, (await signInOverHttp(baseUrl, managerEmail, passwordOf(managerEmail))).cookie);
      await stream.waitFor((block) => block.data !== undefined);
      expect(liveOf().connections).toBe(before + 1);
      stream.close();
      await connectionsSettleAt(before);
    });

    it('answers 406 without Accept: text/event-stream and 401 signed out', async () => {
      const { cookie } = await signInOverHttp(baseUrl, managerEmail, passwordOf(managerEmail));
      expect((await fetch(`${baseUrl}/api/events`, { headers: { cookie } })).status).toBe(406);
      expect((await fetch(`${baseUrl}/api/events`, { headers: { accept: 'text/event-stream' } })).status).toBe(401);
    });
  });
});
