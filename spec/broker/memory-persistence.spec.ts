import { createRequire } from 'node:module';
import type { Readable } from 'node:stream';
import { IndexedMemoryPersistence } from '../../broker/memory-persistence';

// The reference: aedes-persistence 11's own in-memory persistence, whose outgoing-queue
// semantics the indexed one must keep.
const requireCjs = createRequire(__filename);
const ReferencePersistence = requireCjs('aedes-persistence/asyncPersistence.js');

type Packet = { cmd: string; topic: string; payload: Buffer; qos: number; brokerId: string; brokerCounter: number; messageId?: number };

async function drain(stream: Readable): Promise<unknown[]> {
  const items: unknown[] = [];
  for await (const item of stream) items.push(item);
  return items;
}

/** A small deterministic generator (mulberry32), so a failure can be replayed. */
function rng(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const view = (items: unknown[]) => (items as Packet[]).map((p) => ({ cmd: p.cmd, brokerId: p.brokerId, brokerCounter: p.brokerCounter, messageId: p.messageId }));

describe('broker: indexed in-memory persistence', () => {
  it('keeps the outgoing queue exactly as aedes-persistence does, over random enqueue / deliver / ack sequences', async () => {
    for (const seed of [1, 2, 3, 4, 5]) {
      const random = rng(seed);
      const reference = new ReferencePersistence();
      const indexed = new IndexedMemoryPersistence();
      const client = { id: 'cw-ingest-all' };
      let counter = 0;
      let nextMessageId = 1;
      const delivered: number[] = [];
      const undelivered: Packet[] = [];
      for (let step = 0; step < 2000; step++) {
        const roll = random();
        if (roll < 0.45) {
          const packet: Packet = { cmd: 'publish', topic: 'cw/v1/s/1/x/reading', payload: Buffer.from('{}'), qos: 1, brokerId: random() < 0.8 ? 'b1' : 'b2', brokerCounter: ++counter };
          await reference.outgoingEnqueueCombi([{ clientId: client.id }], packet);
          await indexed.outgoingEnqueueCombi([{ clientId: client.id }], packet);
          undelivered.push(packet);
        } else if (roll < 0.8 && undelivered.length) {
          // The broker delivers the oldest waiting packet with a fresh message id.
          const packet = { ...undelivered.shift()!, messageId: (nextMessageId++ % 65535) + 1 };
          await reference.outgoingUpdate(client, packet);
          await indexed.outgoingUpdate(client, packet);
          delivered.push(packet.messageId);
        } else if (delivered.length) {
          // PUBACKs mostly in order, sometimes out of order, sometimes for an unknown id.
          const index = random() < 0.8 ? 0 : Math.floor(random() * delivered.length);
          const messageId = random() < 0.05 ? 99_999 : delivered.splice(index, 1)[0];
          const [a, b] = [await reference.outgoingClearMessageId(client, { messageId }), await indexed.outgoingClearMessageId(client, { messageId })];
          expect(b && view([b])).withContext(`seed ${seed} step ${step}`).toEqual(a && view([a]));
        }
      }
      expect(view(await drain(indexed.outgoingStream(client)))).withContext(`seed ${seed}`).toEqual(view(await drain(reference.outgoingStream(client))));
    }
  });

  it('refuses to update a packet it never stored, like aedes-persistence', async () => {
    const indexed = new IndexedMemoryPersistence();
    await expectAsync(indexed.outgoingUpdate({ id: 'x' }, { brokerId: 'b1', brokerCounter: 9, messageId: 3 })).toBeRejectedWithError('no such packet');
  });

  it('replaces a packet of another broker that holds the same message id (QoS 2 PUBREL)', async () => {
    const reference = new ReferencePersistence();
    const indexed = new IndexedMemoryPersistence();
    const client = { id: 'c' };
    const packet = { cmd: 'publish', topic: 't', payload: Buffer.from(''), qos: 2, brokerId: 'b1', brokerCounter: 1 };
    for (const persistence of [reference, indexed]) {
      await persistence.outgoingEnqueue({ clientId: 'c' }, packet);
      await persistence.outgoingUpdate(client, { ...packet, messageId: 7 });
      await persistence.outgoingUpdate(client, { cmd: 'pubrel', messageId: 7 });
    }
    expect(view(await drain(indexed.outgoingStream(client)))).toEqual(view(await drain(reference.outgoingStream(client))));
  });
});
