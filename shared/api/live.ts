/**
 * `GET /api/events`: the live feed as server-sent events (WHATWG HTML, "Server-sent
 * events"). Each message is one JSON object on a `data:` line of the default `message`
 * event, with an `id:`; a comment line every HEARTBEAT_MS keeps proxies from closing an
 * idle stream. Missed events are not replayed: after a reconnect the client reloads what
 * it shows (Last-Event-ID is not needed).
 */
import type { LiveEvent } from './monitor';

export const LIVE_EVENTS_PATH = '/api/events';

/** A comment line this often (common practice: below the 30–60 s idle limits of proxies). */
export const HEARTBEAT_MS = 25_000;

/** The reconnection time the stream asks EventSource for (its `retry:` field). */
export const RETRY_MS = 3_000;

/** The first message of every stream: who it is for. */
export interface LiveHello {
  type: 'live.hello';
  atMs: number;
  role: string;
  heartbeatMs: number;
}

/** What a client receives on the stream. */
export type LiveMessage = LiveEvent | LiveHello;

export type { LiveEvent, LiveEventType } from './monitor';
