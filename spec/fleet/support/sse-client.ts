/**
 * A minimal server-sent-events reader over fetch, as a browser's EventSource reads the
 * stream (WHATWG HTML, "Server-sent events": blank-line separated blocks of `field: value`
 * lines, `:` starting a comment), plus a sign-in that keeps the cookies by hand.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type { Express } from 'express';

export interface SseBlock {
  id: string | null;
  data: unknown;
  retry: number | null;
  comment: string | null;
}

export async function listen(app: Express): Promise<{ baseUrl: string; server: Server }> {
  const server = await new Promise<Server>((resolve) => {
    const started = app.listen(0, '127.0.0.1', () => resolve(started));
  });
  return { baseUrl: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };
}

function cookiesOf(res: Response, jar: Map<string, string>): void {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(';');
    const index = pair.indexOf('=');
    jar.set(pair.slice(0, index), pair.slice(index + 1));
  }
}

const cookieHeader = (jar: Map<string, string>) => [...jar].map(([name, value]) => `${name}=${value}`).join('; ');

/** Signs in as the web client does (session cookie, CSRF header); returns the Cookie header. */
export async function signInOverHttp(baseUrl: string, email: string, password: string): Promise<{ cookie: string; csrf: string }> {
  const jar = new Map<string, string>();
  const opened = await fetch(`${baseUrl}/api/auth/session`);
  // express-session stores the session while the body's last byte is still pending: wait for it.
  await opened.text();
  cookiesOf(opened, jar);
  const csrf = decodeURIComponent(jar.get('XSRF-TOKEN') ?? '');
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: cookieHeader(jar), 'x-xsrf-token': csrf },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  await res.text();
  cookiesOf(res, jar);
  return { cookie: cookieHeader(jar), csrf: decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') };
}

function parseBlock(block: string): SseBlock {
  const parsed: SseBlock = { id: null, data: undefined, retry: null, comment: null };
  const data: string[] = [];
  for (const line of block.split('\n')) {
    if (line.startsWith(':')) parsed.comment = line.slice(1).trim();
    else if (line.startsWith('id:')) parsed.id = line.slice(3).trim();
    else if (line.startsWith('retry:')) parsed.retry = Number(line.slice(6).trim());
    else if (line.startsWith('data:')) data.push(line.slice(5).trimStart());
  }
  if (data.length) parsed.data = JSON.parse(data.join('\n'));
  return parsed;
}

export class SseStream {
  readonly blocks: SseBlock[] = [];
  readonly ended: Promise<void>;
  private readonly controller = new AbortController();
  private waiters: (() => void)[] = [];

  private constructor(readonly response: Response) {
    this.ended = this.read();
  }

  static async open(baseUrl: string, cookie: string): Promise<SseStream> {
    const controller = new AbortController();
    const response = await fetch(`${baseUrl}/api/events`, { headers: { cookie, accept: 'text/event-stream' }, signal: controller.signal });
    const stream = new SseStream(response);
    stream.controller.signal.addEventListener('abort', () => controller.abort());
    return stream;
  }

  get events(): unknown[] {
    return this.blocks.filter((block) => block.data !== undefined).map((block) => block.data);
  }

  /** Resolves once a block satisfies `test`, or rejects after `timeoutMs`. */
  async waitFor(test: (block: SseBlock) => boolean, timeoutMs = 3000): Promise<SseBlock> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const found = this.blocks.find(test);
      if (found) return found;
      if (Date.now() > deadline) throw new Error(`no such block within ${timeoutMs} ms; got ${JSON.stringify(this.blocks)}`);
      await new Promise<void>((resolve) => {
        this.waiters.push(resolve);
        setTimeout(resolve, 50);
      });
    }
  }

  close(): void {
    this.controller.abort();
  }

  private async read(): Promise<void> {
    const reader = this.response.body!.getReader();
    const decoder = new TextDecoder();
    let buffered = '';
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) return;
        buffered += decoder.decode(value, { stream: true });
        let end: number;
        while ((end = buffered.indexOf('\n\n')) >= 0) {
          this.blocks.push(parseBlock(buffered.slice(0, end)));
          buffered = buffered.slice(end + 2);
        }
        for (const wake of this.waiters.splice(0)) wake();
      }
    } catch {
      // aborted by close()
    }
  }
}
