/** Structured logger: one JSON line per event, so logs can be searched by field. */
export interface Logger {
  error(message: string, fields?: Record<string, unknown>): void;
  warn(message: string, fields?: Record<string, unknown>): void;
  info(message: string, fields?: Record<string, unknown>): void;
  debug(message: string, fields?: Record<string, unknown>): void;
}

const LEVELS = ['error', 'warn', 'info', 'debug'] as const;
type Level = (typeof LEVELS)[number];

type Entry = { level: Level; message: string; fields: Record<string, unknown> };

// Both loggers are the same four methods over a different sink.
function loggerOver(sink: (entry: Entry) => void): Logger {
  const at =
    (level: Level) =>
    (message: string, fields: Record<string, unknown> = {}) =>
      sink({ level, message, fields });
  return { error: at('error'), warn: at('warn'), info: at('info'), debug: at('debug') };
}

/** A logger writing JSON lines at or above `level` to `write`. */
export function createLogger(
  level: Level,
  write: (line: string) => void = (line) => process.stdout.write(line),
): Logger {
  const limit = LEVELS.indexOf(level);
  return loggerOver(({ level: at, message, fields }) => {
    if (LEVELS.indexOf(at) > limit) return;
    write(`${JSON.stringify({ time: new Date().toISOString(), level: at, message, ...fields })}\n`);
  });
}

/** A logger that keeps entries in memory, for tests that check what was logged. */
export function createMemoryLogger(): Logger & { entries: Entry[] } {
  const entries: Entry[] = [];
  return { entries, ...loggerOver((entry) => entries.push(entry)) };
}
