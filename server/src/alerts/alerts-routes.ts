import type { Router } from 'express';
import { z } from 'zod';
import type { MonitorLatest, SystemStatus } from '@cellwarden/shared';
import type { SystemsService } from '../systems/systems-service';
import { queryTimeSchema } from '../telemetry/query-time';
import type { AlertsService } from './alerts-service';
import type { LiveAnalytics } from './live-analytics';
import { createSystemRouter } from '../systems/system-router';

const DAY_MS = 24 * 3600_000;
const alertsQuery = z.object({
  from: queryTimeSchema('from').optional(),
  to: queryTimeSchema('to').optional(),
  active: z.enum(['true', 'false'], { error: 'active must be true or false' }).optional(),
});
const acknowledgement = z.object({
  note: z
    .string({ error: 'note is required' })
    .trim()
    .max(500, 'note must be at most 500 characters')
    .regex(/^[^\p{Cc}]*$/u, 'note must not contain control characters'),
});

/** Alerts and the live status of one system, under /api/systems. */
export function createAlertsRoutes(deps: {
  alerts: AlertsService;
  systems: SystemsService;
  analytics: LiveAnalytics;
  /** The system's monitors with their newest readings, lead first. */
  monitors: (systemId: string) => Promise<MonitorLatest[]>;
}): Router {
  const router = createSystemRouter();
  router.get('/:systemId/alerts', async (req, res) => {
    const query = alertsQuery.parse(req.query);
    const to = query.to ?? new Date();
    const from = query.from ?? new Date(to.getTime() - 30 * DAY_MS);
    const alerts = await deps.alerts.list(req.currentUser!, req.params.systemId, {
      from,
      to,
      activeOnly: query.active === 'true',
    });
    res.json({ alerts });
  });
  router.post('/:systemId/alerts/:alertId/acknowledge', async (req, res) => {
    const { note } = acknowledgement.parse(req.body ?? {});
    res.json({
      alert: await deps.alerts.acknowledge(req.currentUser!, req.params.systemId, req.params.alertId, note),
    });
  });
  router.get('/:systemId/status', async (req, res) => {
    const system = await deps.systems.getFor(req.currentUser!, req.params.systemId, 'view');
    const now = new Date();
    const status: SystemStatus = {
      systemId: system.id,
      latestReading: system.latestReading,
      derived: await deps.analytics.derivedFor(system.id, system.latestReading),
      activeAlerts: await deps.alerts.list(req.currentUser!, system.id, {
        from: now,
        to: now,
        activeOnly: true,
      }),
      monitors: await deps.monitors(system.id),
    };
    res.json({ status });
  });
  return router;
}
