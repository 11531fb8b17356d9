import type { Response } from 'supertest';
import type { Browser } from '../../auth/support/browser';
import { createWorld, type Person, type World } from '../../auth/support/world';

export { createWorld };
export type { Person, World };

/** A multipart upload as the Angular client sends it: the file as field "file", plus text fields. */
export async function upload(browser: Browser, path: string, file: { name: string; content: string | Buffer }, fields: Record<string, string> = {}): Promise<Response> {
  let call = browser.agent.post(path).set('X-XSRF-TOKEN', browser.csrfToken);
  for (const [name, value] of Object.entries(fields)) call = call.field(name, value);
  return call.attach('file', Buffer.isBuffer(file.content) ? file.content : Buffer.from(file.content, 'utf8'), file.name);
}

/** Polls an import until it leaves `running`. */
export async function finishedImport(browser: Browser, importId: string): Promise<Response> {
  for (let tries = 0; tries < 500; tries++) {
    const res = await browser.get(`/api/inventory/import/${importId}`);
    if (res.status !== 200 || res.body.state !== 'running') return res;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  throw new Error(`import ${importId} still running`);
}

/** Rows of a table in the world's database. */
export async function count(world: World, sql: string, params: unknown[] = []): Promise<number> {
  const [row] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM (${sql}) counted`, params);
  return row.n;
}

export const NEW_PROPERTY = {
  name: 'Alder Court',
  addressLine1: '12 Example Avenue',
  city: 'Springfield',
  region: 'IL',
  postalCode: '62701',
  timeZone: 'America/Chicago',
};
