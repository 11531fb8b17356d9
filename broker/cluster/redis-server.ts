import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startProcess, tcpOpen, waitFor, type ManagedProcess } from './processes';

function redisServerPath(): string | null {
  for (const candidate of ['/usr/bin/redis-server', '/usr/local/bin/redis-server']) if (fs.existsSync(candidate)) return candidate;
  const found = spawnSync('sh', ['-c', 'command -v redis-server'], { encoding: 'utf8' });
  return found.status === 0 ? found.stdout.trim() : null;
}

/** Debian's redis-server, installed with apt-get when missing (needs root, like PostgreSQL's set-up). */
export function ensureRedisServer(log: (message: string) => void = () => undefined): string {
  const existing = redisServerPath();
  if (existing) return existing;
  if (process.getuid?.() !== 0) throw new Error('redis-server is missing: install it with `apt-get install redis-server` (needs root)');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  log('apt-get install redis-server');
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', '--no-install-recommends', 'redis-server']]) {
    const result = spawnSync('apt-get', args, { env, stdio: 'ignore' });
    if (result.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
  const installed = redisServerPath();
  if (!installed) throw new Error('redis-server is still missing after apt-get install');
  return installed;
}

/** A private, memory-only Redis on 127.0.0.1 (no snapshots, no append-only file), its files in a temp folder. */
export async function startRedis(port: number, binary = ensureRedisServer()): Promise<ManagedProcess & { url: string }> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-redis-'));
  const redis = startProcess('redis', binary, ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--dir', dir, '--daemonize', 'no'], {});
  await waitFor('starting', redis, () => tcpOpen(port), 15_000);
  const stop = redis.stop;
  return {
    ...redis,
    url: `redis://127.0.0.1:${port}`,
    async stop(signal) {
      await stop(signal);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
