/**
 * The live feed's audience rules: which bus events each connected person receives.
 * A manager: everything of their organization. A tenant: what happens in their own unit.
 * A contractor: what happens in a unit their work order reaches (Scope decides, so the
 * work-order loop's extension of Scope.contractorReaches applies here too).
 * Internal events (appliance.status) never leave the server.
 */
import type { Logger } from 'pino';
import type { LiveEvent, LiveEventType } from '../../shared/api/monitor';
import type { Actor } from '../auth/actor';
import type { Scope } from '../auth/scope';
import type { BusEvent, EventBus } from '../events/bus';

/** The bus events a client may receive; anything else stays inside the server. */
export const LIVE_EVENT_TYPES: ReadonlySet<LiveEventType> = new Set<LiveEventType>([
  'appliance.health-changed',
  'incident.opened',
  'incident.updated',
  'incident.closed',
  'work-order.changed',
  'service-request.changed',
]);

/** How long a contractor's "may I see this unit" answer is reused. */
const CONTRACTOR_REACH_CACHE_MS = 30_000;

export type Deliver = (event: LiveEvent, id: number) => void;

interface Subscriber {
  actor: Actor;
  deliver: Deliver;
  /** Keeps a contractor's events in order while their scope checks run. */
  chain: Promise<void>;
  reach: Map<string, { allowed: boolean; atMs: number }>;
}

function isLive(event: BusEvent): event is LiveEvent {
  return LIVE_EVENT_TYPES.has(event.type as LiveEventType);
}

export class LiveEventsService {
  private readonly subscribers = new Set<Subscriber>();
  private stopListening: (() => void) | null = null;
  private sequence = 0;

  constructor(private readonly deps: { bus: EventBus; scope: Scope; logger: Logger; nowMs?: () => number }) {}

  get connections(): number {
    return this.subscribers.size;
  }

  /** Starts delivering the actor's events; returns the function that stops it. */
  subscribe(actor: Actor, deliver: Deliver): () => void {
    const subscriber: Subscriber = { actor, deliver, chain: Promise.resolve(), reach: new Map() };
    this.subscribers.add(subscriber);
    this.stopListening ??= this.deps.bus.onAny((event) => this.fanOut(event));
    return () => {
      this.subscribers.delete(subscriber);
      if (!this.subscribers.size && this.stopListening) {
        this.stopListening();
        this.stopListening = null;
      }
    };
  }

  /** Synchronous for managers and tenants; never makes the bus (and so the ingest) wait. */
  private fanOut(event: BusEvent): void {
    if (!isLive(event)) return;
    const id = ++this.sequence;
    for (const subscriber of this.subscribers) {
      if (subscriber.actor.role !== 'contractor') {
        if (this.directlyReaches(subscriber.actor, event)) this.safeDeliver(subscriber, event, id);
        continue;
      }
      subscriber.chain = subscriber.chain
        .then(async () => {
          if (await this.contractorReaches(subscriber, event)) this.safeDeliver(subscriber, event, id);
        })
        .catch((error: unknown) => this.deps.logger.warn({ err: error }, 'live feed: scope check failed'));
    }
  }

  private directlyReaches(actor: Actor, event: LiveEvent): boolean {
    if (actor.role === 'manager') return !!actor.organizationId && actor.organizationId === event.organizationId;
    if (actor.role === 'tenant') return !!actor.unitId && actor.unitId === event.unitId;
    return false;
  }

  private async contractorReaches(subscriber: Subscriber, event: LiveEvent): Promise<boolean> {
    if (!event.unitId || !this.subscribers.has(subscriber)) return false;
    const nowMs = (this.deps.nowMs ?? Date.now)();
    const cached = subscriber.reach.get(event.unitId);
    if (cached && nowMs - cached.atMs < CONTRACTOR_REACH_CACHE_MS) return cached.allowed;
    const allowed = await this.deps.scope.canReadUnit(subscriber.actor, event.unitId);
    subscriber.reach.set(event.unitId, { allowed, atMs: nowMs });
    return allowed;
  }

  private safeDeliver(subscriber: Subscriber, event: LiveEvent, id: number): void {
    try {
      subscriber.deliver(event, id);
    } catch (error) {
      this.deps.logger.warn({ err: error }, 'live feed: delivery failed');
    }
  }
}
