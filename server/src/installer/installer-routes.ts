import { type Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { EnergyBudgetInput } from '@cellwarden/shared';
import { uploadDownloadHeaders } from '../uploads/upload-download-headers';
import type { CommissioningRecordService } from './commissioning-record-service';
import type { CommissioningService } from './commissioning-service';
import type { EnergyBudgetsService } from './energy-budgets-service';
import type { UploadsService } from './uploads-service';
import { createSystemRouter } from '../systems/system-router';

const optionalPositive = (field: string, max: number) =>
  z
    .number({ error: `${field} must be a number` })
    .positive(`${field} must be above 0`)
    .max(max)
    .optional();

const checkBody = z.object({
  sourceId: z
    .string({ error: 'sourceId is required' })
    .regex(/^[a-z0-9][a-z0-9-]{0,31}$/, 'sourceId names a charge source'),
  ratedCurrentA: z
    .number({ error: 'ratedCurrentA must be a number' })
    .positive('ratedCurrentA must be above 0')
    .max(1000)
    .optional(),
  tolerancePercent: z.number({ error: 'tolerancePercent must be a number' }).min(1).max(50).optional(),
  windowSeconds: z
    .number({ error: 'windowSeconds must be a number' })
    .int()
    .min(60, 'windowSeconds must be at least 60')
    .max(1800),
  sourceOutputVoltage: optionalPositive('sourceOutputVoltage', 70),
  batteryTerminalVoltage: optionalPositive('batteryTerminalVoltage', 70),
  gauge: z.string().max(8).optional(),
  oneWayLengthM: optionalPositive('oneWayLengthM', 100),
});

const budgetBody = z.object({
  name: z
    .string({ error: 'name is required' })
    .trim()
    .min(1, 'name is required')
    .max(120)
    .regex(/^[^\p{Cc}]*$/u, 'name must not contain control characters'),
  // The shape and ranges are checked by the shared budget computation, which names the bad field.
  budget: z.object(
    {
      loads: z.array(z.unknown()).max(100),
      sources: z.array(z.unknown()).max(50),
      system: z.object({}).passthrough(),
    },
    { error: 'budget must have loads, sources and system' },
  ),
});

// The installer's pick of checks for the record: ids separated by commas in the query (empty: none), or a
// list in an e-mail request's body; absent, the record carries the default choice.
const checkIds = z
  .array(z.string().uuid('checks must hold check ids'))
  .max(100, 'checks may name at most 100 checks');
const recordQuery = z.object({
  checks: z
    .union([
      z
        .string()
        .max(4000)
        .transform((s) => (s === '' ? [] : s.split(','))),
      checkIds,
    ])
    .pipe(checkIds)
    .optional(),
});

/** Commissioning checks, the commissioning record, uploads and energy budgets under /api/systems. */
export function createInstallerRoutes(deps: {
  checks: CommissioningService;
  record: CommissioningRecordService;
  uploads: UploadsService;
  budgets: EnergyBudgetsService;
  uploadMiddleware: RequestHandler;
}): Router {
  const router = createSystemRouter();
  router.post('/:systemId/commissioning-checks', async (req, res) => {
    const body = checkBody.parse(req.body ?? {});
    res.status(201).json({ check: await deps.checks.start(req.currentUser!, req.params.systemId, body) });
  });
  router.get('/:systemId/commissioning-checks', async (req, res) => {
    res.json({ checks: await deps.checks.list(req.currentUser!, req.params.systemId) });
  });
  router.get('/:systemId/commissioning-checks/:checkId', async (req, res) => {
    res.json({ check: await deps.checks.get(req.currentUser!, req.params.systemId, req.params.checkId) });
  });
  router.get('/:systemId/commissioning-record/choices', async (req, res) => {
    res.json({ choices: await deps.record.choices(req.currentUser!, req.params.systemId) });
  });
  router.get('/:systemId/commissioning-record.pdf', async (req, res) => {
    const { checks } = recordQuery.parse(req.query);
    const pdf = await deps.record.render(req.currentUser!, req.params.systemId, checks);
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': 'attachment; filename="commissioning-record.pdf"',
    });
    res.send(pdf);
  });
  router.post('/:systemId/commissioning-record/email', async (req, res) => {
    const { checks } = recordQuery.parse(req.body ?? {});
    res
      .status(202)
      .json({ sentTo: await deps.record.emailToOwner(req.currentUser!, req.params.systemId, checks) });
  });
  router.post('/:systemId/uploads', deps.uploadMiddleware, async (req, res) => {
    const upload = await deps.uploads.add(
      req.currentUser!,
      String(req.params.systemId),
      req.file,
      req.body ?? {},
    );
    res.status(201).json({ upload });
  });
  router.get('/:systemId/uploads', async (req, res) => {
    res.json({ uploads: await deps.uploads.list(req.currentUser!, req.params.systemId) });
  });
  router.get('/:systemId/uploads/:uploadId', async (req, res) => {
    const { record, stream } = await deps.uploads.open(
      req.currentUser!,
      req.params.systemId,
      req.params.uploadId,
    );
    res.set(uploadDownloadHeaders({ contentType: record.contentType, fileName: record.fileName }));
    stream.pipe(res);
  });
  router.get('/:systemId/energy-budgets', async (req, res) => {
    res.json({ budgets: await deps.budgets.list(req.currentUser!, req.params.systemId) });
  });
  router.post('/:systemId/energy-budgets', async (req, res) => {
    const body = budgetBody.parse(req.body ?? {});
    res.status(201).json({
      budget: await deps.budgets.save(
        req.currentUser!,
        req.params.systemId,
        body.name,
        body.budget as unknown as EnergyBudgetInput,
      ),
    });
  });
  router.put('/:systemId/energy-budgets/:budgetId', async (req, res) => {
    const body = budgetBody.parse(req.body ?? {});
    res.json({
      budget: await deps.budgets.save(
        req.currentUser!,
        req.params.systemId,
        body.name,
        body.budget as unknown as EnergyBudgetInput,
        req.params.budgetId,
      ),
    });
  });
  router.delete('/:systemId/energy-budgets/:budgetId', async (req, res) => {
    await deps.budgets.remove(req.currentUser!, req.params.systemId, req.params.budgetId);
    res.status(204).end();
  });
  router.get('/:systemId/energy-budgets/:budgetId/comparison', async (req, res) => {
    const { days } = z.object({ days: z.coerce.number().int().min(1).max(90).default(7) }).parse(req.query);
    res.json({
      comparison: await deps.budgets.compare(
        req.currentUser!,
        req.params.systemId,
        req.params.budgetId,
        days,
      ),
    });
  });
  return router;
}
