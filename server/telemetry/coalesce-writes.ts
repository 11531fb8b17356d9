import type { Socket } from 'node:net';

/**
 * Holds a socket's writes until the event loop's current turn ends, then sends them as one
 * writev. mqtt-packet corks each packet only until the next tick, so a broker relaying
 * thousands of small PUBLISH / PUBACK packets a second makes a syscall per packet; here one
 * turn's packets for a connection leave together. Node's cork()/uncork() nest (a counter),
 * so mqtt-packet's own per-packet uncork leaves this outer cork in place.
 */
export function coalesceWrites(socket: Pick<Socket, 'cork' | 'uncork' | 'write' | 'destroyed'>): void {
  const write = socket.write.bind(socket) as (...args: unknown[]) => boolean;
  let held = false;
  const release = () => {
    held = false;
    if (!socket.destroyed) socket.uncork();
  };
  socket.write = ((...args: unknown[]) => {
    if (!held) {
      held = true;
      socket.cork();
      setImmediate(release);
    }
    return write(...args);
  }) as Socket['write'];
}
