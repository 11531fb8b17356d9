/**
 * The in-process event bus: the monitor and the work-order services publish what changed;
 * the work-order automation and (later) the web app's live feed listen. Typed by event
 * name. publish() waits for every handler, so a batch is fully handled (requests opened,
 * e-mails sent) before the ingest takes the next one; a failing handler is logged and
 * never stops the others.
 */
import type { Logger } from 'pino';
import type { LiveEvent } from '../../shared/api/monitor';
import type { ApplianceStatusEvent } from './internal';

/** Events for the web app's feed, plus internal ones no client ever receives. */
export type BusEvent = LiveEvent | ApplianceStatusEvent;
export type BusEventType = BusEvent['type'];
export type BusEventOf<T extends BusEventType> = Extract<BusEvent, { type: T }>;
export type BusHandler<E> = (event: E) => void | Promise<void>;

export class EventBus {
  private readonly handlers = new Map<BusEventType, Set<BusHandler<never>>>();
  private readonly anyHandlers = new Set<BusHandler<BusEvent>>();

  constructor(private readonly logger?: Logger) {}

  /** Listens to one type of event; returns the function that stops listening. */
  on<T extends BusEventType>(type: T, handler: BusHandler<BusEventOf<T>>): () => void {
    const set = this.handlers.get(type) ?? new Set();
    set.add(handler as BusHandler<never>);
    this.handlers.set(type, set);
    return () => set.delete(handler as BusHandler<never>);
  }

  /** Listens to every event (the live feed filters by place and audience itself). */
  onAny(handler: BusHandler<BusEvent>): () => void {
    this.anyHandlers.add(handler);
    return () => this.anyHandlers.delete(handler);
  }

  async publish(event: BusEvent): Promise<void> {
    const typed = [...(this.handlers.get(event.type) ?? [])] as BusHandler<BusEvent>[];
    const all = [...typed, ...this.anyHandlers];
    const outcomes = await Promise.allSettled(all.map(async (handler) => handler(event)));
    for (const outcome of outcomes) {
      if (outcome.status === 'rejected') this.logger?.error({ err: outcome.reason, event: event.type }, 'event handler failed');
    }
  }

  async publishAll(events: readonly BusEvent[]): Promise<void> {
    for (const event of events) await this.publish(event);
  }
}
