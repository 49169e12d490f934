import express, { Router } from 'express';
import { z } from 'zod';
import { invalidInput } from '../errors/app-error';
import { queryTimeSchema } from './query-time';
import type { ReadingsCsvService } from './readings-csv-service';

const MAX_RANGE_MS = 400 * 24 * 3600_000;
const exportQuery = z.object({ from: queryTimeSchema('from'), to: queryTimeSchema('to') });

/** The export's range, checked before any header is sent. */
function parseExportRange(query: unknown): { from: Date; to: Date } {
  const { from, to } = exportQuery.parse(query);
  if (from >= to) throw invalidInput('from', 'from must be before to');
  if (to.getTime() - from.getTime() > MAX_RANGE_MS)
    throw invalidInput('from', 'range must be at most 400 days');
  return { from, to };
}

/** GET /api/systems/:systemId/readings.csv and POST /api/systems/:systemId/readings/import (text/csv). */
export function createReadingsCsvRoutes(csv: ReadingsCsvService): Router {
  const router = Router();
  router.get('/:systemId/readings.csv', async (req, res) => {
    const { from, to } = parseExportRange(req.query);
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
