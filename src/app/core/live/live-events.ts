import { Injectable, InjectionToken, computed, inject, signal } from '@angular/core';
import { Observable, Subject, share } from 'rxjs';
import { LIVE_EVENTS_PATH, type LiveEvent, type LiveMessage } from '../../../../shared/api/live';
import { Session } from '../auth/session';
import { reconnectDelayMs } from './reconnect-delay';

/** `connecting` the first time, `open` once the server said hello, `reconnecting` after a drop. */
export type LiveStatus = 'idle' | 'connecting' | 'open' | 'reconnecting';

/** Makes the EventSource; specs replace it with a fake they drive by hand. */
export const EVENT_SOURCE_FACTORY = new InjectionToken<(url: string) => EventSource>('EventSource factory', {
  providedIn: 'root',
  factory: () => (url: string) => new EventSource(url, { withCredentials: true }),
});

/** Makes the reconnect waits random (jitter); specs pin it. */
export const RECONNECT_RANDOM = new InjectionToken<() => number>('reconnect jitter', { providedIn: 'root', factory: () => Math.random });

/**
 * The live feed (server-sent events from /api/events) as one shared Observable: the
 * stream opens with the first subscriber and closes with the last. When it drops, this
 * service closes it and reconnects after an exponentially growing, jittered wait (so a
 * server restart is not met by every browser at once); `reconnected$` then tells pages
 * to reload what they show, since events sent while away are not replayed.
 */
@Injectable({ providedIn: 'root' })
export class LiveEvents {
  private readonly session = inject(Session);
  private readonly createSource = inject(EVENT_SOURCE_FACTORY);
  private readonly random = inject(RECONNECT_RANDOM);
  private readonly statusSignal = signal<LiveStatus>('idle');
  private readonly lastEventAt = signal<number | null>(null);
  private readonly attemptsSignal = signal(0);
  private readonly reconnectedSubject = new Subject<void>();

  readonly status = this.statusSignal.asReadonly();
  readonly connected = computed(() => this.statusSignal() === 'open');
  /** Failed attempts since the stream was last open. */
  readonly attempts = this.attemptsSignal.asReadonly();
  readonly lastEventAtMs = this.lastEventAt.asReadonly();
  readonly reconnected$ = this.reconnectedSubject.asObservable();

  readonly events$: Observable<LiveEvent> = new Observable<LiveEvent>((subscriber) => {
    let source: EventSource | null = null;
    let retryTimer: ReturnType<typeof setTimeout> | null = null;
    let everOpened = false;

    const connect = () => {
      retryTimer = null;
      if (!this.session.signedIn()) {
        this.statusSignal.set('idle');
        return;
      }
      this.statusSignal.set(everOpened || this.attemptsSignal() > 0 ? 'reconnecting' : 'connecting');
      source = this.createSource(LIVE_EVENTS_PATH);
      source.onmessage = (message: MessageEvent<string>) => {
        const parsed = parse(message.data);
        if (!parsed) return;
        if (parsed.type === 'live.hello') {
          this.attemptsSignal.set(0);
          this.statusSignal.set('open');
          if (everOpened) this.reconnectedSubject.next();
          everOpened = true;
          return;
        }
        this.lastEventAt.set(Date.now());
        subscriber.next(parsed);
      };
      source.onerror = () => {
        source?.close();
        source = null;
        this.statusSignal.set('reconnecting');
        retryTimer = setTimeout(connect, reconnectDelayMs(this.attemptsSignal(), this.random));
        this.attemptsSignal.update((attempts) => attempts + 1);
      };
    };

    connect();
    return () => {
      if (retryTimer !== null) clearTimeout(retryTimer);
      source?.close();
      this.statusSignal.set('idle');
      this.attemptsSignal.set(0);
    };
  }).pipe(share());
}

function parse(data: string): LiveMessage | null {
  try {
    const value = JSON.parse(data) as LiveMessage;
    return value && typeof value.type === 'string' ? value : null;
  } catch {
    return null;
  }
}
