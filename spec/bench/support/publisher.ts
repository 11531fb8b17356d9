import { spawn } from 'node:child_process';
import path from 'node:path';
import readline from 'node:readline';

/** A sensor as the publisher process signs it in: its own credentials, and which broker. */
export interface PublishingDevice {
  deviceId: string;
  secret: string;
  url: string;
}

export interface Publisher {
  run(run: Record<string, unknown>): Promise<{ publishMs: number }>;
  stop(): void;
}

/**
 * Starts spec/bench/ingest-publisher.ts in its own process (the sensors' side of the
 * ingest benchmarks) and resolves once every device is signed in.
 */
export async function startPublisher(devices: PublishingDevice[], options: { window: number; nodeArgs?: string[] }): Promise<Publisher> {
  const config = JSON.stringify({ devices: devices.map(({ deviceId, secret, url }) => ({ deviceId, secret, url })) });
  const child = spawn(process.execPath, [...(options.nodeArgs ?? []), '--import', 'tsx', path.join(__dirname, '..', 'ingest-publisher.ts'), config], {
    env: { ...process.env, TSX_TSCONFIG_PATH: path.join(__dirname, '..', '..', '..', 'server', 'tsconfig.json') },
  });
  child.stderr.on('data', (chunk) => process.stderr.write(chunk));
  const lines = readline.createInterface({ input: child.stdout });
  const waiting: ((line: string) => void)[] = [];
  lines.on('line', (line) => waiting.shift()?.(line));
  const next = () => new Promise<string>((resolve) => waiting.push(resolve));
  if ((await next()) !== 'ready') throw new Error('publisher did not start');
  return {
    async run(run) {
      const reply = next();
      child.stdin.write(`go ${JSON.stringify({ window: options.window, ratePerS: null, timestamps: 'sequence', baseMs: 0, stepMs: 1000, firstSeq: 0, ...run })}\n`);
      return JSON.parse((await reply).slice('done '.length));
    },
    stop: () => child.stdin.end('quit\n'),
  };
}
