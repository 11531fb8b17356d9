// Starts the long-running services in order, waits for each to be ready, and stops them
// all (whole process groups, in reverse order) on request or when one of them dies.
import net from 'node:net';
import { services } from './services.mjs';
import { log, startChild, stopChild } from './shell.mjs';

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

async function httpReady(url, acceptStatus) {
  try {
    const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
    return acceptStatus.includes(response.status);
  } catch {
    return false;
  }
}

function tcpReady(address) {
  const [host, port] = address.split(':');
  return new Promise((resolve) => {
    const socket = net.connect({ host, port: Number(port) });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

async function waitReady(service, child, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`${service.name} exited with ${child.exitCode} while starting`);
    const ready = service.ready?.http
      ? await httpReady(service.ready.http, service.ready.acceptStatus ?? [200])
      : service.ready?.tcp
        ? await tcpReady(service.ready.tcp)
        : true;
    if (ready) return;
    await sleep(250);
  }
  throw new Error(`${service.name} was not ready within ${timeoutMs / 1000} s`);
}

/**
 * @returns {Promise<{ stop(): Promise<void>, exited: Promise<string> }>} `exited` resolves
 * with the name of the first service that stopped by itself.
 */
export async function startServices(env, options = {}) {
  const running = [];
  let onExit;
  const exited = new Promise((resolve) => (onExit = resolve));
  let stopping = false;
  const stop = async () => {
    stopping = true;
    for (const child of [...running].reverse()) await stopChild(child);
  };
  try {
    for (const service of services(env, options)) {
      log(`starting ${service.name}`);
      const child = startChild(service.name, service.command, service.args, { env: service.env ?? env, stdio: options.stdio ?? 'inherit' });
      child.once('exit', () => !stopping && onExit(service.name));
      running.push(child);
      await waitReady(service, child);
    }
  } catch (error) {
    await stop();
    throw error;
  }
  return { stop, exited };
}
