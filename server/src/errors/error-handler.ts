import type { ErrorRequestHandler } from 'express';
import { ConnectionError, TimeoutError } from 'sequelize';
import { ZodError } from 'zod';
import { AnalyticsSettingError, InstallerInputError } from '@cellwarden/shared';
import { AppError } from './app-error';
import type { Logger } from '../logger';

/** The one place errors become HTTP answers: `{ error: { code, message, field } }`. */
export function createErrorHandler(logger: Logger): ErrorRequestHandler {
  return (error, _req, res, next) => {
    // Once a streamed answer has begun, no error body can follow: Express's own handler closes the
    // connection, so the client sees a cut answer rather than a truncated one that looks complete.
    if (res.headersSent) {
      logger.error('answer failed after its headers were sent', { error: String(error?.stack ?? error) });
      return next(error);
    }
    const answer = toAppError(error);
    if (answer.status >= 500)
      logger.error('request failed', { code: answer.code, error: String(error?.stack ?? error) });
    res
      .status(answer.status)
      .json({ error: { code: answer.code, message: answer.message, field: answer.field } });
  };
}

function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof ZodError) {
    const issue = error.issues[0];
    const field = issue.path.join('.') || undefined;
    return new AppError('invalid_input', 400, field ? `${field}: ${issue.message}` : issue.message, field);
  }
  // PostgreSQL away or restarting: the caller may retry; this is not our bug and not theirs.
  if (error instanceof ConnectionError || error instanceof TimeoutError || isConnectionRefusal(error))
    return new AppError(
      'database_unavailable',
      503,
      'The database is not reachable right now; try again shortly',
    );
  // The shared computations validate their own inputs and name the field; that is the caller's bad input.
  if (error instanceof InstallerInputError || error instanceof AnalyticsSettingError)
    return new AppError('invalid_input', 400, error.message, error.field);
  const bodyError = error as { type?: string; status?: number; message?: string };
  if (bodyError?.type === 'entity.parse.failed')
    return new AppError('malformed_json', 400, 'Request body is not valid JSON');
  if (bodyError?.type === 'entity.too.large')
    return new AppError('payload_too_large', 413, 'Request body is too large');
  if (typeof bodyError?.status === 'number' && bodyError.status >= 400 && bodyError.status < 500) {
    return new AppError('bad_request', bodyError.status, bodyError.message ?? 'Bad request');
  }
  return new AppError('internal_error', 500, 'Something went wrong on our side');
}

// pg's own errors while the server shuts down or restarts (57P01 admin shutdown, 57P03 cannot connect now).
function isConnectionRefusal(error: unknown): boolean {
  const code =
    (error as { original?: { code?: string }; parent?: { code?: string } })?.original?.code ??
    (error as { parent?: { code?: string } })?.parent?.code;
  return code === '57P01' || code === '57P03' || code === 'ECONNREFUSED' || code === 'ECONNRESET';
}
