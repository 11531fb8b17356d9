import net from 'node:net';
import { coalesceWrites } from '../../server/telemetry/coalesce-writes';

const nextTurn = () => new Promise((resolve) => setImmediate(resolve));

describe('coalesceWrites', () => {
  it('corks a socket once per event-loop turn and uncorks when the turn ends', async () => {
    const calls: string[] = [];
    const socket = {
      destroyed: false,
      cork: () => calls.push('cork'),
      uncork: () => calls.push('uncork'),
      write: (chunk: string) => calls.push(`write ${chunk}`) > 0,
    };
    coalesceWrites(socket as unknown as net.Socket);
    socket.write('a');
    socket.write('b');
    expect(calls).toEqual(['cork', 'write a', 'write b']);
    await nextTurn();
    expect(calls).toEqual(['cork', 'write a', 'write b', 'uncork']);
    socket.write('c');
    await nextTurn();
    expect(calls.slice(4)).toEqual(['cork', 'write c', 'uncork']);
  });

  it('does not uncork a socket destroyed meanwhile', async () => {
    let uncorked = 0;
    const socket = { destroyed: false, cork: () => undefined, uncork: () => uncorked++, write: () => true };
    coalesceWrites(socket as unknown as net.Socket);
    socket.write();
    socket.destroyed = true;
    await nextTurn();
    expect(uncorked).toBe(0);
  });

  it('delivers every byte, in order, over a real TCP connection', async () => {
    const received: Buffer[] = [];
    const server = net.createServer((peer) => peer.on('data', (data) => received.push(data)));
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as net.AddressInfo;
    const client = net.connect(port, '127.0.0.1');
    await new Promise((resolve) => client.once('connect', resolve));
    coalesceWrites(client);
    const expected: string[] = [];
    for (let turn = 0; turn < 20; turn++) {
      for (let i = 0; i < 50; i++) {
        const packet = `${turn}:${i};`;
        expected.push(packet);
        client.write(packet);
      }
      await nextTurn();
    }
    await new Promise<void>((resolve) => client.end(resolve));
    await new Promise((resolve) => setTimeout(resolve, 50));
    server.close();
    expect(Buffer.concat(received).toString()).toBe(expected.join(''));
  });
});
