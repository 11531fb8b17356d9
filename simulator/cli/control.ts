import http from 'node:http';
import type { FaultCode } from '../model';
import type { FleetFile } from './fleet';
import type { FleetRunner } from './fleet-runner';
import { FAULT_CODES } from './schedule';

/**
 * Faults on command, for demos and end-to-end tests, on 127.0.0.1 only:
 *   GET    /status
 *   POST   /faults  {"device": "cw-…" | "property": "p1", "fault": "evaporator-fan", "severity"?: 0..1, "minutes"?: n}
 *   DELETE /faults  {"device" | "property", "fault"}   (the repair)
 */
interface FaultCommand {
  device?: string;
  property?: string;
  fault?: string;
  severity?: number;
  minutes?: number;
}

function readJson(req: http.IncomingMessage): Promise<FaultCommand> {
  return new Promise((resolve, reject) => {
    let body = '';
    req.setEncoding('utf8');
    req.on('data', (chunk: string) => {
      body += chunk;
      if (body.length > 10_000) req.destroy(new Error('body too large'));
    });
    req.on('end', () => {
      try {
        resolve(body ? (JSON.parse(body) as FaultCommand) : {});
      } catch (error) {
        reject(error);
      }
    });
    req.on('error', reject);
  });
}

function send(res: http.ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
}

function targets(command: FaultCommand, fleet: FleetFile): string[] {
  if (command.device) return [command.device];
  if (command.property) return fleet.devices.filter((device) => device.propertyKey === command.property).map((device) => device.deviceId);
  return [];
}

async function handle(req: http.IncomingMessage, res: http.ServerResponse, runner: FleetRunner, fleet: FleetFile): Promise<void> {
  if (req.method === 'GET' && req.url === '/status') {
    return send(res, 200, { simulatedNow: new Date(runner.simulatedNowMs).toISOString(), published: runner.published, devices: fleet.devices.map((d) => d.deviceId) });
  }
  if (req.url !== '/faults' || (req.method !== 'POST' && req.method !== 'DELETE')) return send(res, 404, { error: 'no such endpoint' });
  const command = await readJson(req);
  const fault = command.fault as FaultCode;
  if (!FAULT_CODES.includes(fault)) return send(res, 400, { error: `fault must be one of ${FAULT_CODES.join(', ')}` });
  const ids = targets(command, fleet);
  const nowMs = runner.simulatedNowMs;
  const applied = ids.filter((deviceId) =>
    req.method === 'POST'
      ? runner.inject(deviceId, { fault, startMs: nowMs, endMs: command.minutes ? nowMs + command.minutes * 60_000 : null, severity: command.severity })
      : runner.clear(deviceId, fault),
  );
  if (!applied.length) return send(res, 404, { error: 'no such device or property in this fleet' });
  send(res, 200, { applied, at: new Date(nowMs).toISOString() });
}

export function startControlServer(port: number, runner: FleetRunner, fleet: FleetFile): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    handle(req, res, runner, fleet).catch((error: Error) => send(res, 400, { error: error.message }));
  });
  return new Promise((resolve) => server.listen(port, '127.0.0.1', () => resolve(server)));
}
