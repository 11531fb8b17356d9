import { timingSafeEqual } from 'node:crypto';
import type { AedesOptions, AuthenticateError, Client, PublishPacket, Subscription } from 'aedes';
import { readingTopic, TOPIC_ROOT } from '../shared/telemetry';
import { secretFingerprint } from '../server/telemetry/device-secret';
import type { IngestAccount } from '../server/telemetry/ingest-account';
import type { DeviceAuthenticator } from './device-auth';
import type { RejectSink } from './reject-sink';

type Identity = { kind: 'ingest' } | { kind: 'device'; deviceId: string; sensorId: string };

/** CONNACK return codes, MQTT 3.1.1 §3.2.2.3. */
const IDENTIFIER_REJECTED = 2;
const SERVER_UNAVAILABLE = 3;
const BAD_USERNAME_OR_PASSWORD = 4;

function authError(message: string, returnCode: number): AuthenticateError {
  return Object.assign(new Error(message), { returnCode }) as AuthenticateError;
}

function sameSecret(given: Buffer | undefined, expected: string): boolean {
  if (!given) return false;
  // Compare fixed-length digests so the comparison time says nothing about the length.
  return timingSafeEqual(Buffer.from(secretFingerprint(given)), Buffer.from(secretFingerprint(expected)));
}

/** An ingest worker may subscribe to reading topics of whole shards only. */
function isIngestFilter(topic: string): boolean {
  return new RegExp(`^${TOPIC_ROOT}/(\\d+|\\+)/\\+/reading$`).test(topic);
}

export interface AuthHooksDeps {
  devices: DeviceAuthenticator;
  ingest: IngestAccount;
  rejects: RejectSink;
  maxPayloadBytes: number;
  onInternalError(error: Error): void;
}

/**
 * The broker's three hooks. Every sensor signs in with its own device id (as user name
 * and as client id) and secret; the ingest has its own account. Each hook decides with
 * early returns, and records what it refuses.
 */
export function authHooks(deps: AuthHooksDeps): Pick<AedesOptions, 'authenticate' | 'authorizePublish' | 'authorizeSubscribe'> {
  const identities = new WeakMap<Client, Identity>();

  const authenticate: AedesOptions['authenticate'] = (client, username, password, done) => {
    if (username === deps.ingest.username) {
      if (!sameSecret(password, deps.ingest.password)) {
        deps.rejects.record({ reason: 'wrong-secret', sensorId: null, deviceId: username, topic: null, detail: 'ingest account', payloadExcerpt: null });
        return done(authError('bad user name or password', BAD_USERNAME_OR_PASSWORD), false);
      }
      identities.set(client, { kind: 'ingest' });
      return done(null, true);
    }
    const deviceId = username ?? '';
    // The client id must be the device id: one session per device, and no device can take over another's (§3.1.3.1).
    if (client.id !== deviceId) {
      deps.rejects.record({ reason: 'client-id-mismatch', sensorId: null, deviceId: deviceId || null, topic: null, detail: `client id ${client.id.slice(0, 64)}`, payloadExcerpt: null });
      return done(authError('client id must equal the device id', IDENTIFIER_REJECTED), false);
    }
    deps.devices
      .check(deviceId, password)
      .then((result) => {
        if (!result.ok) {
          deps.rejects.record({ reason: result.reason, sensorId: result.sensorId, deviceId, topic: null, detail: 'sign-in refused', payloadExcerpt: null });
          return done(authError('bad user name or password', BAD_USERNAME_OR_PASSWORD), false);
        }
        identities.set(client, { kind: 'device', deviceId, sensorId: result.sensorId });
        done(null, true);
      })
      .catch((error: Error) => {
        deps.onInternalError(error);
        done(authError('credential store unavailable', SERVER_UNAVAILABLE), false);
      });
  };

  /** A refused publish closes the connection (aedes 1.x); MQTT 3.1.1 has no PUBACK failure code. */
  const authorizePublish: AedesOptions['authorizePublish'] = (client, packet: PublishPacket, callback) => {
    if (!client) return callback(null);
    const identity = identities.get(client);
    if (identity?.kind !== 'device') return callback(new Error('this account does not publish'));
    const refuse = (reason: 'publish-denied' | 'payload-too-large', detail: string) => {
      deps.rejects.record({ reason, sensorId: identity.sensorId, deviceId: identity.deviceId, topic: packet.topic.slice(0, 200), detail, payloadExcerpt: null });
      callback(new Error(detail));
    };
    if (packet.topic !== readingTopic(identity.deviceId)) return refuse('publish-denied', 'not the device’s own reading topic');
    if (packet.retain) return refuse('publish-denied', 'retained readings are not allowed');
    const size = typeof packet.payload === 'string' ? Buffer.byteLength(packet.payload) : packet.payload.length;
    if (size > deps.maxPayloadBytes) return refuse('payload-too-large', `${size} bytes`);
    callback(null);
  };

  /** A refused subscription gets a failure SUBACK (0x80, §3.9.3) and the connection stays. */
  const authorizeSubscribe: AedesOptions['authorizeSubscribe'] = (client, subscription: Subscription, callback) => {
    const identity = identities.get(client);
    if (identity?.kind === 'ingest' && isIngestFilter(subscription.topic)) return callback(null, subscription);
    if (identity?.kind === 'device') {
      deps.rejects.record({ reason: 'subscribe-denied', sensorId: identity.sensorId, deviceId: identity.deviceId, topic: subscription.topic.slice(0, 200), detail: 'sensors do not subscribe', payloadExcerpt: null });
    }
    callback(null, null);
  };

  return { authenticate, authorizePublish, authorizeSubscribe };
}
