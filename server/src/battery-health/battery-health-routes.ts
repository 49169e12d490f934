import type { Request } from 'express';
import type { Router } from 'express';
import { z } from 'zod';
import { HEALTH_REPORT_MAX_DAYS } from '@cellwarden/shared';
import { invalidInput } from '../errors/app-error';
import { queryTimeSchema } from '../telemetry/query-time';
import type { BatteryHealthService } from './battery-health-service';
import { healthReportCsv } from './health-report-csv';
import type { HealthReportRenderer } from './health-report-renderer';
import { createSystemRouter } from '../systems/system-router';

// A BCP 47 tag as Intl understands it; anything else is refused with the field named, never passed on.
const localeSchema = z
  .string({ error: 'locale must be a language tag such as en-GB' })
  .max(35, 'locale must be at most 35 characters')
  .refine((tag) => {
    try {
      return Intl.getCanonicalLocales(tag).length === 1;
    } catch {
      return false;
    }
  }, 'locale must be a language tag such as en-GB');
// The viewer's temperature unit for the sentences and the report; °C unless asked otherwise.
const unitSchema = z.enum(['C', 'F'], { error: 'unit must be C or F' }).default('C');
const overviewQuery = z.object({ locale: localeSchema.optional(), unit: unitSchema });
const reportQuery = z.object({
  from: queryTimeSchema('from'),
  to: queryTimeSchema('to'),
  locale: localeSchema.optional(),
  unit: unitSchema,
});

/** The locale asked for, else the browser's first language, else English. */
function localeOf(req: Request, asked: string | undefined): string {
  if (asked) return asked;
  const first = req.acceptsLanguages()[0];
  return first && first !== '*' && localeSchema.safeParse(first).success ? first : 'en';
}

/** The report's period, checked before anything is read. */
function parsePeriod(req: Request) {
  const { from, to, locale, unit } = reportQuery.parse(req.query);
  if (from >= to) throw invalidInput('from', 'from must be before to');
  if (to.getTime() - from.getTime() > HEALTH_REPORT_MAX_DAYS * 86400_000)
    throw invalidInput('to', `the period must be at most ${HEALTH_REPORT_MAX_DAYS} days`);
  return { from: from.getTime(), to: to.getTime(), locale: localeOf(req, locale), unit };
}

/** File name of a report: the period's first and last day, nothing from the system's own name. */
function fileName(from: number, to: number, extension: string): string {
  const day = (at: number) => new Date(at).toISOString().slice(0, 10);
  return `battery-health-${day(from)}-to-${day(to - 1)}.${extension}`;
}

/** GET /api/systems/:systemId/battery-health, …/battery-health/report.pdf and …/report.csv. */
export function createBatteryHealthRoutes(deps: {
  health: BatteryHealthService;
  renderer: HealthReportRenderer;
}): Router {
  const router = createSystemRouter();
  router.get('/:systemId/battery-health', async (req, res) => {
    const { locale, unit } = overviewQuery.parse(req.query);
    res.json(await deps.health.overview(req.currentUser!, req.params.systemId, localeOf(req, locale), unit));
  });
  router.get('/:systemId/battery-health/report.pdf', async (req, res) => {
    const period = parsePeriod(req);
    const report = await deps.health.report(req.currentUser!, req.params.systemId, {
      ...period,
      format: 'pdf',
    });
    const pdf = await deps.renderer.render(report);
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="${fileName(period.from, period.to, 'pdf')}"`,
    });
    res.send(pdf);
  });
  router.get('/:systemId/battery-health/report.csv', async (req, res) => {
    const period = parsePeriod(req);
    const report = await deps.health.report(req.currentUser!, req.params.systemId, {
      ...period,
      format: 'csv',
    });
    res.set({
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="${fileName(period.from, period.to, 'csv')}"`,
      'X-Content-Type-Options': 'nosniff',
    });
    res.send(healthReportCsv(report));
  });
  return router;
}
