import type { z } from 'zod';
import { AppError } from '../errors/app-error';

/**
 * Parses a body and, when it is wrong, names every wrong field in one 400 (a long form should not be fixed
 * one refusal at a time); `field` is the first of them, as in every other error.
 */
export function parseNamingEveryField<T extends z.ZodType>(schema: T, body: unknown): z.infer<T> {
  const result = schema.safeParse(body ?? {});
  if (result.success) return result.data;
  const seen = new Set<string>();
  const problems = result.error.issues.filter((issue) => {
    const field = issue.path.join('.');
    if (seen.has(field)) return false;
    seen.add(field);
    return true;
  });
  const first = problems[0].path.join('.') || undefined;
  const message = problems
    .map((issue) => (issue.path.length ? `${issue.path.join('.')}: ${issue.message}` : issue.message))
    .join('; ');
  throw new AppError('invalid_input', 400, message, first);
}
