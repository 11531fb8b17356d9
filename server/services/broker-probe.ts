import net from 'node:net';
import { probe, type ComponentProbe } from './health';

/**
 * Reachability of the MQTT broker: a TCP connection to its address. It does not sign
 * in, so it works whichever broker a deployment points MQTT_URL at.
 */
export function brokerProbe(mqttUrl: string): ComponentProbe {
  const url = new URL(mqttUrl);
  const port = Number(url.port || (url.protocol === 'mqtts:' ? 8883 : 1883));
  return () =>
    probe(
      () =>
        new Promise<string>((resolve, reject) => {
          const socket = net.connect({ host: url.hostname, port });
          socket.once('connect', () => {
            socket.destroy();
            resolve(`MQTT broker at ${url.hostname}:${port}`);
          });
          socket.once('error', (error) => reject(new Error(`${url.hostname}:${port}: ${error.message}`)));
        }),
    );
}
