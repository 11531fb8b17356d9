import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { loadConfig } from '../../server/config';
import { startControlServer } from './control';
import { FLEET_FILE_NAME, readFleetFile, SIMULATOR_STATE_FILE_NAME, type FleetFile } from './fleet';
import { FleetRunner, type ResumeState } from './fleet-runner';
import { watchCompletedWork } from './repairs';
import { faultsFor, parseFaultSpec, parseWhenMs, type ParsedFault } from './schedule';

const HELP = `Chillwarden fleet simulator: plays the sensors of a fleet file over MQTT, each with
its own credentials, from a physical model of each appliance.

Usage: node dist/server/simulator/cli/main.js [options]
       (development: npx tsx --tsconfig server/tsconfig.json simulator/cli/main.ts [options])

Fleet
  --fleet FILE            fleet file (default: <data dir>/${FLEET_FILE_NAME}, written by npm run seed)
  --properties N          play only the first N properties of the fleet
  --appliances N          play at most N appliances per property
  --broker URL            MQTT broker (default: $MQTT_URL or mqtt://127.0.0.1:1884)
  --interval SECONDS      report every SECONDS instead of each sensor's own interval

Time
  --backfill-days N       first write N days of history at full speed, ending now
  --start WHEN            first reading time instead (ISO 8601, or -2d for two days ago)
  --replay-hours H        play the last H hours before now at --speed instead of full speed
  --speed X               simulated seconds per real second after the backfill (default 1;
                          60 runs an hour a minute). Time never runs ahead of the clock
                          unless --allow-future is given.
  --backfill-only         exit once the backfill is written and acknowledged
  --idle-without-fleet    with no fleet file, say so and wait instead of failing (npm start)
  --no-resume             ignore where the last run stopped (<data dir>/${SIMULATOR_STATE_FILE_NAME})

Faults (the fleet file's own schedule applies unless --no-faults)
  --fault SPEC            CODE@TARGET[,start=WHEN][,for=DURATION][,severity=0..1][,probe=P]
                          CODE: evaporator-fan defrost-system condenser-airflow compressor-start
                          air-damper door-seal power-loss sensor-disconnected sensor-power-on
                          sensor-stuck sensor-dropout
                          TARGET: device id, appliance number (1-based), or property:KEY
                          WHEN: +6h (after the start), -2d (before now) or ISO 8601
                          e.g. --fault power-loss@property:p1,start=-8h,for=5h
  --no-faults             no scheduled faults at all
  --control-port PORT     accept faults on command: POST/DELETE http://127.0.0.1:PORT/faults
  --repair-on-completion  demo: a work order completed in the app ends its appliance's
                          faults (watches $DATABASE_URL)

  --help                  this text
`;

interface CliOptions {
  fleetFile: string;
  brokerUrl: string;
  properties: number | null;
  appliances: number | null;
  intervalSeconds: number | null;
  backfillDays: number;
  start: string | null;
  replayHours: number;
  speed: number;
  backfillOnly: boolean;
  resume: boolean;
  faults: string[];
  noFaults: boolean;
  allowFuture: boolean;
  controlPort: number | null;
  idleWithoutFleet: boolean;
  repairOnCompletion: boolean;
}

function positive(name: string, text: string | undefined, allowZero = false): number | null {
  if (text === undefined) return null;
  const value = Number(text);
  if (!Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) throw new Error(`--${name} takes a ${allowZero ? 'non-negative' : 'positive'} number`);
  return value;
}

export function parseCli(argv: string[], env: NodeJS.ProcessEnv, dataDir: string): CliOptions | 'help' {
  const { values } = parseArgs({
    args: argv,
    strict: true,
    options: {
      fleet: { type: 'string' },
      broker: { type: 'string' },
      properties: { type: 'string' },
      appliances: { type: 'string' },
      interval: { type: 'string' },
      'backfill-days': { type: 'string' },
      start: { type: 'string' },
      'replay-hours': { type: 'string' },
      speed: { type: 'string' },
      'backfill-only': { type: 'boolean' },
      'no-resume': { type: 'boolean' },
      fault: { type: 'string', multiple: true },
      'no-faults': { type: 'boolean' },
      'allow-future': { type: 'boolean' },
      'control-port': { type: 'string' },
      'idle-without-fleet': { type: 'boolean' },
      'repair-on-completion': { type: 'boolean' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) return 'help';
  return {
    fleetFile: values.fleet ?? path.join(dataDir, FLEET_FILE_NAME),
    brokerUrl: values.broker ?? env.MQTT_URL ?? 'mqtt://127.0.0.1:1884',
    properties: positive('properties', values.properties),
    appliances: positive('appliances', values.appliances),
    intervalSeconds: positive('interval', values.interval),
    backfillDays: positive('backfill-days', values['backfill-days'], true) ?? 0,
    start: values.start ?? null,
    replayHours: positive('replay-hours', values['replay-hours'], true) ?? 0,
    speed: positive('speed', values.speed) ?? 1,
    backfillOnly: values['backfill-only'] ?? false,
    resume: !values['no-resume'],
    faults: values.fault ?? [],
    noFaults: values['no-faults'] ?? false,
    allowFuture: values['allow-future'] ?? false,
    controlPort: positive('control-port', values['control-port']),
    idleWithoutFleet: values['idle-without-fleet'] ?? false,
    repairOnCompletion: values['repair-on-completion'] ?? false,
  };
}

function selectDevices(fleet: FleetFile, options: CliOptions): FleetFile {
  const keys = fleet.properties.slice(0, options.properties ?? undefined).map((property) => property.key);
  const perProperty = new Map<string, number>();
  const devices = fleet.devices.filter((device) => {
    if (!keys.includes(device.propertyKey)) return false;
    const count = (perProperty.get(device.propertyKey) ?? 0) + 1;
    perProperty.set(device.propertyKey, count);
    return count <= (options.appliances ?? Infinity);
  });
  return { ...fleet, properties: fleet.properties.filter((property) => keys.includes(property.key)), devices };
}

function readResume(file: string, enabled: boolean): ResumeState {
  if (!enabled || !fs.existsSync(file)) return {};
  try {
    return JSON.parse(fs.readFileSync(file, 'utf8')) as ResumeState;
  } catch {
    return {};
  }
}

async function main(): Promise<void> {
  const dataDir = loadConfig().dataDir;
  const options = parseCli(process.argv.slice(2), process.env, dataDir);
  if (options === 'help') {
    process.stdout.write(HELP);
    return;
  }
  if (!fs.existsSync(options.fleetFile)) {
    const message = `no fleet file at ${options.fleetFile}: run \`npm run seed -- --reset\`, or pass --fleet FILE`;
    if (!options.idleWithoutFleet) throw new Error(message);
    // Under npm start an exiting service stops the whole stack; an idle simulator does not.
    console.log(`[simulator] ${message}; nothing to simulate`);
    setInterval(() => undefined, 1 << 30);
    return;
  }
  const fleet = selectDevices(readFleetFile(options.fleetFile), options);
  const nowMs = Date.now();
  const startMs = options.start ? parseWhenMs(options.start, nowMs, nowMs) : nowMs - options.backfillDays * 86_400_000;
  const faults: ParsedFault[] = options.noFaults ? [] : [...fleet.faults, ...options.faults.map((spec) => parseFaultSpec(spec, fleet, startMs, nowMs))];
  const stateFile = path.join(dataDir, SIMULATOR_STATE_FILE_NAME);
  const log = (message: string) => console.log(`[simulator] ${message}`);

  const runner = new FleetRunner({
    mqttUrl: options.brokerUrl,
    devices: fleet.devices,
    faultsFor: (device) => faultsFor(device, faults),
    startMs,
    replayFromMs: nowMs - options.replayHours * 3_600_000,
    speed: options.speed,
    allowFuture: options.allowFuture,
    intervalSecondsOverride: options.intervalSeconds,
    resume: readResume(stateFile, options.resume),
    stateFile,
    tickMs: 1000,
    log,
  });
  await runner.start();
  if (options.backfillOnly) {
    await runner.stop();
    return;
  }
  const control = options.controlPort ? await startControlServer(options.controlPort, runner, fleet) : null;
  if (control) log(`faults on command at http://127.0.0.1:${options.controlPort}/faults`);
  const repairs = options.repairOnCompletion ? watchCompletedWork(loadConfig().databaseUrl, runner, fleet, log) : null;
  log(`live at ${options.speed}× (${fleet.devices.length} sensors, ${faults.length} scheduled faults)`);
  const stop = async () => {
    control?.close();
    await repairs?.stop();
    await runner.stop();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop());
  process.once('SIGTERM', () => void stop());
}

if (require.main === module) {
  main().catch((error) => {
    console.error(`[simulator] ${(error as Error).message}`);
    process.exit(1);
  });
}

