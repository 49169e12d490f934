import express, { Router } from 'express';
import { z } from 'zod';
import type { ReadingsCsvService } from './readings-csv-service';

const MAX_RANGE_MS = 400 * 24 * 3600_000;
const exportQuery = z
  .object({
    from: z.iso
      .datetime({ offset: true, error: 'from must be an ISO 8601 time' })
      .transform((t) => new Date(t)),
    to: z.iso.datetime({ offset: true, error: 'to must be an ISO 8601 time' }).transform((t) => new Date(t)),
  })
  .refine((q) => q.from < q.to, { message: 'from must be before to', path: ['from'] })
  .refine((q) => q.to.getTime() - q.from.getTime() <= MAX_RANGE_MS, {
    message: 'range must be at most 400 days',
    path: ['from'],
  });

/** GET /api/systems/:systemId/readings.csv and POST /api/systems/:systemId/readings/import (text/csv). */
export function createReadingsCsvRoutes(csv: ReadingsCsvService): Router {
  const router = Router();
  router.get('/:systemId/readings.csv', async (req, res) => {
    const { from, to } = exportQuery.parse(req.query);
    const chunks = csv.export(req.currentUser!, req.params.systemId, from, to);
    const first = await chunks.next(); // access is checked before any header is sent
    res.set({
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': 'attachment; filename="cellwarden-readings.csv"',
      'X-Content-Type-Options': 'nosniff',
    });
    if (!first.done) res.write(first.value);
    for await (const chunk of chunks) res.write(chunk);
    res.end();
  });
  router.post(
    '/:systemId/readings/import',
    express.text({ type: ['text/csv', 'text/plain'], limit: '16mb' }),
    async (req, res) => {
      if (typeof req.body !== 'string') {
        res.status(415).json({
          error: { code: 'unsupported_media_type', message: 'Send the CSV as text/csv', field: 'file' },
        });
        return;
      }
      res.json({ import: await csv.import(req.currentUser!, String(req.params.systemId), req.body) });
    },
  );
  return router;
}
