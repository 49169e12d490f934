/** Structured logger: one JSON line per event, so logs can be searched by field. */
export interface Logger {
  error(message: string, fields?: Record<string, unknown>): void;
  warn(message: string, fields?: Record<string, unknown>): void;
  info(message: string, fields?: Record<string, unknown>): void;
  debug(message: string, fields?: Record<string, unknown>): void;
}

const LEVELS = ['error', 'warn', 'info', 'debug'] as const;
type Level = (typeof LEVELS)[number];

/** A logger writing JSON lines at or above `level` to `write`. */
export function createLogger(
  level: Level,
  write: (line: string) => void = (line) => process.stdout.write(line),
): Logger {
  const limit = LEVELS.indexOf(level);
  const at =
    (lvl: Level) =>
    (message: string, fields: Record<string, unknown> = {}) => {
      if (LEVELS.indexOf(lvl) > limit) return;
      write(`${JSON.stringify({ time: new Date().toISOString(), level: lvl, message, ...fields })}\n`);
    };
  return { error: at('error'), warn: at('warn'), info: at('info'), debug: at('debug') };
}

/** A logger that keeps entries in memory, for tests that check what was logged. */
export function createMemoryLogger(): Logger & {
  entries: { level: Level; message: string; fields: Record<string, unknown> }[];
} {
  const entries: { level: Level; message: string; fields: Record<string, unknown> }[] = [];
  const at =
    (level: Level) =>
    (message: string, fields: Record<string, unknown> = {}) => {
      entries.push({ level, message, fields });
    };
  return { entries, error: at('error'), warn: at('warn'), info: at('info'), debug: at('debug') };
}
