import type { Express } from 'express';
import request from 'supertest';
import type { Response } from 'supertest';

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** The value a Set-Cookie header gives a cookie: a string, '' when cleared, undefined when not set. */
export function cookieFrom(res: Response, name: string): string | undefined {
  const headers = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const header = headers.find((line) => line.startsWith(`${name}=`));
  if (!header) return undefined;
  const value = decodeURIComponent(header.slice(name.length + 1).split(';')[0]);
  return /expires=Thu, 01 Jan 1970/i.test(header) ? '' : value;
}

export function setCookieLine(res: Response, name: string): string | undefined {
  return ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((line) => line.startsWith(`${name}=`));
}

/**
 * A browser as the Angular client behaves: keeps cookies (supertest agent) and copies the
 * XSRF-TOKEN cookie into the X-XSRF-TOKEN header of every state-changing request.
 */
export class Browser {
  readonly agent: ReturnType<typeof request.agent>;
  csrfToken = '';
  sendCsrfHeader = true;
  /** Poses as this client address (the app trusts a proxy on loopback, as supertest is). */
  clientIp: string | null = null;

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  /**
   * With `stream`, asks for an event stream and resolves as soon as the status and headers
   * arrive, dropping the body: for streams that never end.
   */
  async send(method: Method, path: string, body?: unknown, options: { stream?: boolean } = {}): Promise<Response> {
    let call = this.agent[method](path);
    if (options.stream) {
      call = call.set('Accept', 'text/event-stream').buffer(false).parse((res, done) => {
        done(null, null);
        (res as unknown as { destroy(): void }).destroy();
      });
    }
    if (method !== 'get' && this.sendCsrfHeader && this.csrfToken) call = call.set('X-XSRF-TOKEN', this.csrfToken);
    if (this.clientIp) call = call.set('X-Forwarded-For', this.clientIp);
    const res = body === undefined ? await call : await call.send(body as object);
    const token = cookieFrom(res, 'XSRF-TOKEN');
    if (token !== undefined) this.csrfToken = token;
    return res;
  }

  get(path: string) {
    return this.send('get', path);
  }
  post(path: string, body?: unknown) {
    return this.send('post', path, body ?? {});
  }
  patch(path: string, body?: unknown) {
    return this.send('patch', path, body ?? {});
  }
  delete(path: string) {
    return this.send('delete', path);
  }

  /** Opens the app (GET /api/auth/session issues the CSRF cookie), then signs in. */
  async signIn(email: string, password: string): Promise<Response> {
    await this.get('/api/auth/session');
    return this.post('/api/auth/sign-in', { email, password });
  }
}
