import type { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { AuditService } from '../audit/audit-service';
import type { Logger } from '../logger';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import { createBatteryHealthJob, type BatteryHealthJob } from './battery-health-job';
import { createBatteryHealthRepository } from './battery-health-repository';
import { createBatteryHealthRoutes } from './battery-health-routes';
import { createBatteryHealthService } from './battery-health-service';
import { createHealthReportRenderer } from './health-report-renderer';

/** How often the health job looks for new complete rollups (5 minutes). */
export const HEALTH_JOB_INTERVAL_MS = 5 * 60_000;

/** The battery-health component: its routes and its incremental job, started at once and then on an interval. */
export function startBatteryHealth(deps: {
  sequelize: Sequelize;
  systems: SystemsService;
  settings: SettingsRepository;
  audit: AuditService;
  logger: Logger;
  now: () => number;
  intervalMs?: number;
}): { routes: Router; job: BatteryHealthJob; stop(): Promise<void> } {
  const repository = createBatteryHealthRepository(deps.sequelize);
  const job = createBatteryHealthJob({ repository, logger: deps.logger });
  const health = createBatteryHealthService({ ...deps, repository });
  let running: Promise<unknown> = Promise.resolve();
  // One pass at a time on this node; other nodes are kept apart by the per-system lock.
  const pass = () => {
    running = running
      .then(() => job.catchUp())
      .catch((error) => deps.logger.warn('battery health job failed', { error: String(error) }));
  };
  const timer = setInterval(pass, deps.intervalMs ?? HEALTH_JOB_INTERVAL_MS);
  timer.unref();
  pass();
  return {
    routes: createBatteryHealthRoutes({ health, renderer: createHealthReportRenderer() }),
    job,
    /** Stops the interval and waits for a pass under way, so the database is not closed beneath it. */
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
