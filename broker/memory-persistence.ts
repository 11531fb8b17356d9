import { createRequire } from 'node:module';
import { Readable } from 'node:stream';

/**
 * aedes' own in-memory persistence, with the outgoing queue of each client indexed.
 *
 * The stock queue is an array that `outgoingUpdate` and `outgoingClearMessageId` scan from
 * the front for every delivery and every PUBACK. The ingest keeps thousands of messages
 * unacknowledged until their batch is committed, so each delivery scanned thousands of
 * entries and the broker spent its time there. Here each client's queue is a Map in
 * arrival order with two indexes (broker id + counter, message id), so both are O(1); the
 * semantics are those of aedes-persistence 11 (asyncPersistence.js), which this extends.
 * Used when the broker runs without Redis.
 */
interface StoredPacket {
  brokerId?: string;
  brokerCounter?: number;
  messageId?: number;
  [key: string]: unknown;
}

type PersistenceBase = new (options?: Record<string, unknown>) => {
  outgoingEnqueue(sub: { clientId: string }, packet: StoredPacket): Promise<void>;
  outgoingEnqueueCombi(subs: { clientId: string }[], packet: StoredPacket): Promise<void>;
  outgoingUpdate(client: { id: string }, packet: StoredPacket): Promise<void>;
  outgoingClearMessageId(client: { id: string }, packet: StoredPacket): Promise<StoredPacket | undefined>;
  outgoingStream(client: { id: string }): Readable;
};

const requireCjs = createRequire(__filename);
const MemoryPersistence = requireCjs('aedes-persistence/asyncPersistence.js') as PersistenceBase & { Packet: new (packet: StoredPacket) => StoredPacket };

const brokerKey = (packet: StoredPacket) => `${packet.brokerId}\u0000${packet.brokerCounter}`;

export class OutgoingQueue {
  private readonly entries = new Map<number, StoredPacket>();
  private readonly byBroker = new Map<string, number>();
  private readonly byMessageId = new Map<number, number>();
  private nextKey = 0;

  get size(): number {
    return this.entries.size;
  }

  enqueue(packet: StoredPacket): void {
    const key = this.nextKey++;
    this.entries.set(key, packet);
    if (packet.brokerId !== undefined) this.byBroker.set(brokerKey(packet), key);
    if (packet.messageId !== undefined) this.byMessageId.set(packet.messageId, key);
  }

  /** The stored copy gets its message id; a packet of another broker with that id is replaced. */
  update(packet: StoredPacket): boolean {
    const own = packet.brokerId === undefined ? undefined : this.byBroker.get(brokerKey(packet));
    if (own !== undefined) {
      const stored = this.entries.get(own)!;
      if (stored.messageId !== undefined && this.byMessageId.get(stored.messageId) === own) this.byMessageId.delete(stored.messageId);
      stored.messageId = packet.messageId;
      if (packet.messageId !== undefined) this.byMessageId.set(packet.messageId, own);
      return true;
    }
    const sameId = packet.messageId === undefined ? undefined : this.byMessageId.get(packet.messageId);
    if (sameId === undefined || this.entries.get(sameId)!.brokerId === packet.brokerId) return false;
    this.remove(sameId);
    this.entries.set(sameId, packet);
    if (packet.brokerId !== undefined) this.byBroker.set(brokerKey(packet), sameId);
    this.byMessageId.set(packet.messageId!, sameId);
    return true;
  }

  clear(messageId: number | undefined): StoredPacket | undefined {
    const key = messageId === undefined ? this.firstWithoutMessageId() : this.byMessageId.get(messageId);
    if (key === undefined) return undefined;
    const stored = this.entries.get(key);
    this.remove(key);
    return stored;
  }

  snapshot(): StoredPacket[] {
    return [...this.entries.values()];
  }

  private remove(key: number): void {
    const stored = this.entries.get(key);
    if (!stored) return;
    this.entries.delete(key);
    if (stored.brokerId !== undefined && this.byBroker.get(brokerKey(stored)) === key) this.byBroker.delete(brokerKey(stored));
    if (stored.messageId !== undefined && this.byMessageId.get(stored.messageId) === key) this.byMessageId.delete(stored.messageId);
  }

  private firstWithoutMessageId(): number | undefined {
    for (const [key, stored] of this.entries) if (stored.messageId === undefined) return key;
    return undefined;
  }
}

export class IndexedMemoryPersistence extends MemoryPersistence {
  private readonly queues = new Map<string, OutgoingQueue>();

  private queueOf(clientId: string): OutgoingQueue {
    let queue = this.queues.get(clientId);
    if (!queue) this.queues.set(clientId, (queue = new OutgoingQueue()));
    return queue;
  }

  override async outgoingEnqueue(sub: { clientId: string }, packet: StoredPacket): Promise<void> {
    this.queueOf(sub.clientId).enqueue(new MemoryPersistence.Packet(packet));
  }

  override async outgoingEnqueueCombi(subs: { clientId: string }[], packet: StoredPacket): Promise<void> {
    for (const sub of subs) this.queueOf(sub.clientId).enqueue(new MemoryPersistence.Packet(packet));
  }

  override async outgoingUpdate(client: { id: string }, packet: StoredPacket): Promise<void> {
    if (!this.queueOf(client.id).update(packet)) throw new Error('no such packet');
  }

  override async outgoingClearMessageId(client: { id: string }, packet: StoredPacket): Promise<StoredPacket | undefined> {
    return this.queueOf(client.id).clear(packet.messageId);
  }

  override outgoingStream(client: { id: string }): Readable {
    return Readable.from(this.queues.get(client.id)?.snapshot() ?? []);
  }
}
