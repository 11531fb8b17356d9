/**
 * Demo only: the simulated technician. The simulator cannot see a real repair, so with
 * --repair-on-completion it watches the database for work orders completed since it started
 * and ends the faults of that appliance's sensor, as the contractor's visit would have.
 * The verification the server then runs sees a cabinet that really pulls back down.
 */
import { Pool } from 'pg';
import type { FleetFile } from './fleet';
import type { FleetRunner } from './fleet-runner';

const POLL_MS = 5_000;

export interface RepairWatch {
  stop(): Promise<void>;
}

export function watchCompletedWork(databaseUrl: string, runner: FleetRunner, fleet: FleetFile, log: (message: string) => void): RepairWatch {
  const pool = new Pool({ connectionString: databaseUrl, max: 1 });
  const repaired = new Set<string>();
  let sinceMs = Date.now();
  let busy = false;
  const poll = async () => {
    const { rows } = await pool.query<{ id: string; appliance_id: string; completed_at: Date }>(
      `SELECT wo.id, r.appliance_id, wo.completed_at FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id
        WHERE wo.completed_at > $1 AND r.appliance_id IS NOT NULL ORDER BY wo.completed_at`,
      [new Date(sinceMs)],
    );
    for (const row of rows) {
      sinceMs = Math.max(sinceMs, row.completed_at.getTime());
      if (repaired.has(row.id)) continue;
      repaired.add(row.id);
      for (const device of fleet.devices.filter((candidate) => candidate.applianceId === row.appliance_id)) {
        if (runner.repair(device.deviceId)) log(`work order ${row.id} completed: ${device.deviceId} repaired`);
      }
    }
  };
  const timer = setInterval(() => {
    if (busy) return;
    busy = true;
    poll()
      .catch((error: Error) => log(`repair watch: ${error.message}`))
      .finally(() => (busy = false));
  }, POLL_MS);
  return {
    async stop() {
      clearInterval(timer);
      await pool.end();
    },
  };
}
