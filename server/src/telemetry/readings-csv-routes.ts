import { type Router, type ErrorRequestHandler } from 'express';
import { z } from 'zod';
import { AppError, invalidInput } from '../errors/app-error';
import { queryTimeSchema } from './query-time';
import { IMPORT_LIMIT_BYTES } from './readings-csv-reader';
import type { ReadingsCsvService } from './readings-csv-service';
import { createSystemRouter } from '../systems/system-router';

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
  const router = createSystemRouter();
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
  // The body is read as a stream by the service (after the access check), never buffered whole here.
  router.post('/:systemId/readings/import', async (req, res) => {
    if (!req.is(['text/csv', 'text/plain']))
      throw new AppError('unsupported_media_type', 415, 'Send the CSV as text/csv', 'file');
    if (Number(req.headers['content-length']) > IMPORT_LIMIT_BYTES)
      throw new AppError('file_too_large', 413, 'the file must be at most 16 MB', 'file');
    res.json({ import: await csv.import(req.currentUser!, String(req.params.systemId), req) });
  });
  // Named apart from :systemId on purpose: Express hands a refused :systemId's error straight past every later
  // layer that names the same parameter, and a malformed id's 404 needs the body read off too.
  router.use('/:system/readings/import', discardUnreadBody);
  return router;
}

const DISCARD_WAIT_MS = 10_000;

// A refusal can come before the body was read (wrong type, too large, no access) or halfway through it.
// Like body-parser, read off the rest so the client, still sending, gets the answer instead of a reset;
// a client that keeps sending past the wait has the connection closed after the answer.
const discardUnreadBody: ErrorRequestHandler = (error, req, res, next) => {
  if (req.complete || req.destroyed) return next(error);
  let answered = false;
  const answer = () => {
    if (answered) return;
    answered = true;
    clearTimeout(timer);
    if (!req.complete) res.set('Connection', 'close');
    next(error);
  };
  const timer = setTimeout(answer, DISCARD_WAIT_MS);
  req.once('end', answer);
  req.once('close', answer);
  req.resume();
};
