/**
 * The server-sent-events stream (WHATWG HTML, "Server-sent events"): `text/event-stream`,
 * a `retry:` field, one `id:` + `data:` message per event, comment lines as heartbeat.
 * On every heartbeat the session and the account are looked up again, so a sign-out, a
 * deactivation or a change of role or unit ends the stream and the client's reconnect meets the new rules.
 */
import type { Request, Response } from 'express';
import type { LiveHello } from '../../shared/api/live';
import type { LiveEvent } from '../../shared/api/monitor';
import { actorOf, type Actor } from '../auth/actor';
import { HttpError } from '../errors';
import type { LiveEventsService } from '../services/live-events';

export interface EventsControllerDeps {
  live: LiveEventsService;
  /** The account as it is now; null when it no longer may sign in. */
  actorById(id: string): Promise<Actor | null>;
  heartbeatMs: number;
  retryMs: number;
  /** A client this far behind (bytes not yet sent) is dropped; it reconnects and reloads. */
  maxBufferedBytes?: number;
}

const DEFAULT_MAX_BUFFERED_BYTES = 1 << 20;

function sameReach(before: Actor, now: Actor | null): boolean {
  return !!now && now.role === before.role && now.organizationId === before.organizationId && now.unitId === before.unitId;
}

/** Whether the session the stream was opened with still exists (sign-out destroys it). */
function sessionAlive(req: Request): Promise<boolean> {
  const store = req.sessionStore;
  if (!store || !req.sessionID) return Promise.resolve(true);
  return new Promise((resolve) => store.get(req.sessionID, (error: unknown, session?: unknown) => resolve(!error && !!session)));
}

function wantsEventStream(req: Request): boolean {
  return (req.headers.accept ?? '').split(',').some((type) => type.trim().startsWith('text/event-stream'));
}

export function eventsController(deps: EventsControllerDeps) {
  const maxBuffered = deps.maxBufferedBytes ?? DEFAULT_MAX_BUFFERED_BYTES;
  return {
    stream: (req: Request, res: Response) => {
      if (!wantsEventStream(req)) throw new HttpError(406, 'this endpoint speaks text/event-stream only: open it with EventSource');
      const actor = actorOf(req);
      // no-transform keeps the compression middleware from buffering the stream.
      res.writeHead(200, { 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-cache, no-transform', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
      const write = (chunk: string) => {
        res.write(chunk);
        (res as Response & { flush?: () => void }).flush?.();
        if (res.writableLength > maxBuffered) res.end();
      };
      const hello: LiveHello = { type: 'live.hello', atMs: Date.now(), role: actor.role, heartbeatMs: deps.heartbeatMs };
      write(`retry: ${deps.retryMs}\n\n`);
      write(`data: ${JSON.stringify(hello)}\n\n`);
      const unsubscribe = deps.live.subscribe(actor, (event: LiveEvent, id: number) => write(`id: ${id}\ndata: ${JSON.stringify(event)}\n\n`));
      const heartbeat = setInterval(() => {
        write(`: heartbeat ${Date.now()}\n\n`);
        Promise.all([deps.actorById(actor.id), sessionAlive(req)]).then(
          ([now, alive]) => {
            if (!alive || !sameReach(actor, now)) res.end();
          },
          () => undefined,
        );
      }, deps.heartbeatMs);
      res.on('close', () => {
        clearInterval(heartbeat);
        unsubscribe();
      });
    },
  };
}
