/**
 * Calibration for the ingest benchmark: a plain aedes broker (no sign-in, memory
 * persistence) on the port given as argument, in its own process. The benchmark measures
 * it the way ../shared/STACK.md did (one publisher connection with 100 QoS 1 messages in
 * flight, one subscriber), so its figures can be scaled to a quiet machine.
 */
import net from 'node:net';
import { Aedes } from 'aedes';

async function main(): Promise<void> {
  const aedes = await Aedes.createBroker({});
  const server = net.createServer(aedes.handle);
  server.listen(Number(process.argv[2]), '127.0.0.1', () => process.stdout.write('ready\n'));
  process.once('SIGTERM', () => process.exit(0));
}

void main();
