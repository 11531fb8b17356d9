import { provideHttpClient } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { LiveEvent } from '../../../../shared/api/live';
import type { SessionUser } from '../../../../shared/api/session';
import { Session } from '../auth/session';
import { EVENT_SOURCE_FACTORY, LiveEvents, RECONNECT_RANDOM } from './live-events';
import { reconnectDelayMs } from './reconnect-delay';

/** An EventSource the spec drives: the server's hello, messages, and drops. */
class FakeEventSource {
  onmessage: ((event: MessageEvent<string>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  closed = false;
  constructor(readonly url: string) {}
  close(): void {
    this.closed = true;
  }
  send(data: unknown): void {
    this.onmessage?.(new MessageEvent('message', { data: JSON.stringify(data) }));
  }
  hello(): void {
    this.send({ type: 'live.hello', atMs: 0, role: 'manager', heartbeatMs: 25_000 });
  }
  drop(): void {
    this.onerror?.(new Event('error'));
  }
}

const manager: SessionUser = { id: 'm1', email: 'm@example.com', displayName: 'M', role: 'manager', isAdmin: false, organizationId: 'o1', unitId: null, temperatureUnit: 'F', timeZone: null };
const healthEvent: LiveEvent = { type: 'appliance.health-changed', organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1', atMs: 1, health: 'warm', previous: 'cold' };

describe('reconnectDelayMs', () => {
  it('doubles from one second up to thirty, with half of each wait random', () => {
    expect([0, 1, 2, 3, 4, 5, 6].map((attempt) => reconnectDelayMs(attempt, () => 1))).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000]);
    expect([0, 1, 2, 5].map((attempt) => reconnectDelayMs(attempt, () => 0))).toEqual([500, 1000, 2000, 15000]);
  });
});

describe('LiveEvents', () => {
  let sources: FakeEventSource[];
  let live: LiveEvents;
  let session: Session;

  beforeEach(() => {
    sources = [];
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        { provide: EVENT_SOURCE_FACTORY, useValue: (url: string) => sources[sources.push(new FakeEventSource(url)) - 1] as unknown as EventSource },
        { provide: RECONNECT_RANDOM, useValue: () => 1 },
      ],
    });
    session = TestBed.inject(Session);
    session.set(manager);
    live = TestBed.inject(LiveEvents);
    jasmine.clock().install();
  });
  afterEach(() => jasmine.clock().uninstall());

  it('opens one stream for all subscribers, passes events on, and closes it with the last one', () => {
    const seenA: LiveEvent[] = [];
    const seenB: LiveEvent[] = [];
    const a = live.events$.subscribe((event) => seenA.push(event));
    const b = live.events$.subscribe((event) => seenB.push(event));
    expect(sources.length).toBe(1);
    expect(sources[0].url).toBe('/api/events');
    expect(live.status()).toBe('connecting');
    sources[0].hello();
    expect(live.status()).toBe('open');
    sources[0].send(healthEvent);
    expect(seenA).toEqual([healthEvent]);
    expect(seenB).toEqual([healthEvent]);
    a.unsubscribe();
    expect(sources[0].closed).toBeFalse();
    b.unsubscribe();
    expect(sources[0].closed).toBeTrue();
    expect(live.status()).toBe('idle');
  });

  it('reconnects after a drop with growing waits, and announces the reconnect once the server says hello', () => {
    let reconnects = 0;
    live.reconnected$.subscribe(() => reconnects++);
    const subscription = live.events$.subscribe();
    sources[0].hello();
    sources[0].drop();
    expect(sources[0].closed).toBeTrue();
    expect(live.status()).toBe('reconnecting');
    jasmine.clock().tick(999);
    expect(sources.length).toBe(1);
    jasmine.clock().tick(1);
    expect(sources.length).toBe(2);
    sources[1].drop(); // the server is still down: wait 2 s, then 4 s
    jasmine.clock().tick(1999);
    expect(sources.length).toBe(2);
    jasmine.clock().tick(1);
    sources[2].drop();
    jasmine.clock().tick(4000);
    expect(sources.length).toBe(4);
    expect(live.attempts()).toBe(3);
    expect(reconnects).toBe(0);
    sources[3].hello();
    expect(live.status()).toBe('open');
    expect(live.attempts()).toBe(0);
    expect(reconnects).toBe(1);
    // After a good connection the next drop starts over at one second.
    sources[3].drop();
    jasmine.clock().tick(1000);
    expect(sources.length).toBe(5);
    subscription.unsubscribe();
  });

  it('stops retrying when unsubscribed while waiting, and does not connect for a signed-out visitor', () => {
    const subscription = live.events$.subscribe();
    sources[0].drop();
    subscription.unsubscribe();
    jasmine.clock().tick(60_000);
    expect(sources.length).toBe(1);
    session.set(null);
    const again = live.events$.subscribe();
    expect(sources.length).toBe(1);
    expect(live.status()).toBe('idle');
    again.unsubscribe();
  });

  it('ignores messages that are not JSON events', () => {
    const seen: LiveEvent[] = [];
    const subscription = live.events$.subscribe((event) => seen.push(event));
    sources[0].onmessage?.(new MessageEvent('message', { data: 'not json' }));
    sources[0].onmessage?.(new MessageEvent('message', { data: '42' }));
    expect(seen).toEqual([]);
    subscription.unsubscribe();
  });
});
