// Where the project keeps its local state. Everything under .data/ is git-ignored.
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const DATA_DIR = path.resolve(process.env.CHILLWARDEN_DATA_DIR ?? path.join(ROOT, '.data'));
export const PG_DIR = path.join(DATA_DIR, 'postgres');
export const PG_SOCKET_DIR = path.join(DATA_DIR, 'pg-socket');
export const PG_LOG = path.join(DATA_DIR, 'postgres.log');
export const PG_PORT = Number(process.env.PGPORT_CHILLWARDEN ?? 55432);
export const APP_DB = process.env.CHILLWARDEN_DB ?? 'chillwarden';

export function databaseUrl(database = APP_DB) {
  return `postgres://postgres@127.0.0.1:${PG_PORT}/${database}`;
}
