import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';

/** Running from TypeScript sources (tsx) or from the tsc build in dist/server. */
const FROM_SOURCES = __filename.endsWith('.ts');
const ROOT_OF_THIS_BUILD = path.resolve(__dirname, '..', '..');

/**
 * For the processes that move every reading (broker, ingest): a larger young generation,
 * so V8 collects the per-message garbage less often (about 7 % more readings/s in the
 * ingest benchmark here; scripts/lib/services.mjs passes the same flag).
 */
export const THROUGHPUT_NODE_FLAGS = ['--max-semi-space-size=64'];

/** `node` for an entry of this code base, e.g. 'broker/main', from sources or from the build. */
export function nodeArgsFor(entry: string): { args: string[]; env: NodeJS.ProcessEnv } {
  if (!FROM_SOURCES) return { args: [...THROUGHPUT_NODE_FLAGS, path.join(ROOT_OF_THIS_BUILD, `${entry}.js`)], env: {} };
  return {
    args: [...THROUGHPUT_NODE_FLAGS, '--import', 'tsx', path.join(ROOT_OF_THIS_BUILD, `${entry}.ts`)],
    env: { TSX_TSCONFIG_PATH: path.join(ROOT_OF_THIS_BUILD, 'server', 'tsconfig.json') },
  };
}

export interface ManagedProcess {
  name: string;
  child: ChildProcess;
  /** Everything it wrote, for readiness checks and failure messages. */
  output(): string;
  stop(signal?: NodeJS.Signals): Promise<void>;
}

export function startProcess(name: string, command: string, args: string[], env: NodeJS.ProcessEnv, echo = false): ManagedProcess {
  const child = spawn(command, args, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  const collect = (chunk: Buffer) => {
    output = (output + chunk.toString('utf8')).slice(-100_000);
    if (echo) process.stdout.write(`[${name}] ${chunk.toString('utf8')}`);
  };
  child.stdout?.on('data', collect);
  child.stderr?.on('data', collect);
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  return {
    name,
    child,
    output: () => output,
    async stop(signal: NodeJS.Signals = 'SIGTERM') {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill(signal);
      const force = setTimeout(() => child.kill('SIGKILL'), 5000);
      await exited;
      clearTimeout(force);
    },
  };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export async function waitFor(what: string, process: ManagedProcess, ready: () => Promise<boolean> | boolean, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (process.child.exitCode !== null) throw new Error(`${process.name} exited while ${what}:\n${process.output().slice(-2000)}`);
    if (await ready()) return;
    await sleep(100);
  }
  throw new Error(`${process.name}: timed out while ${what}:\n${process.output().slice(-2000)}`);
}

export function tcpOpen(port: number, host = '127.0.0.1'): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host, port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}
