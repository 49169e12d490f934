/** An error the API reports to its caller: a stable code, an HTTP status and, for bad input, the field. */
export class AppError extends Error {
  constructor(
    readonly code: string,
    readonly status: number,
    message: string,
    readonly field?: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'AppError';
  }
}

/** A request field is missing or malformed. */
export function invalidInput(field: string, message: string): AppError {
  return new AppError('invalid_input', 400, message, field);
}

/** The caller is not signed in, or its token is not valid. */
export function notAuthenticated(message = 'Sign in first'): AppError {
  return new AppError('not_authenticated', 401, message);
}

/** The object does not exist, or the caller may not know that it does. */
export function notFound(what: string): AppError {
  return new AppError('not_found', 404, `${what} not found`);
}

/** The caller may see the object but not do this to it. */
export function forbidden(message: string): AppError {
  return new AppError('forbidden', 403, message);
}

/** A dependency (the database) is away; the caller may retry. */
export function serviceUnavailable(message: string, cause?: unknown): AppError {
  return new AppError('service_unavailable', 503, message, undefined, { cause });
}
