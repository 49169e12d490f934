import type { Sequelize } from 'sequelize';
import { createReadingsRepository, type ReadingRow } from '../server/src/telemetry/readings-repository';
import { POINT_BUDGET } from '../server/src/telemetry/readings-service';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
export const HISTORY_RANGES = [
  { label: '1 h', ms: HOUR },
  { label: '1 day', ms: DAY },
  { label: '1 week', ms: 7 * DAY },
  { label: '30 days', ms: 30 * DAY },
  { label: '1 year', ms: 365 * DAY },
];

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/**
 * One system's history as a monitor that has reported for `days` days would leave it: every 5 minutes for the
 * whole span, every 10 s for the last day and every second for the last hour (through the product's own storage).
 */
export async function seedHistory(sequelize: Sequelize, systemId: string, days: number, now: number) {
  const repository = createReadingsRepository(sequelize);
  const row = (measuredAt: number, k: number): ReadingRow => ({
    systemId,
    deviceId: 'bench-history',
    reading: { measuredAt, voltage: 13 + (k % 60) / 200, current: ((k % 24) - 12) / 2, temperature: 10 },
  });
  const grid = (span: number, step: number) => {
    const from = Math.floor((now - span) / step) * step;
    return Array.from({ length: Math.floor(span / step) }, (_, k) => row(from + k * step, k));
  };
  const rows = [...grid(days * DAY, 300_000), ...grid(DAY, 10_000), ...grid(HOUR, 1000)];
  for (let i = 0; i < rows.length; i += 500) await repository.insertBatch(rows.slice(i, i + 500));
  return rows.length;
}

/** The history API against the same repository SQL alone, median of `repeats` each (after one warm-up). */
export async function timeHistory(options: {
  sequelize: Sequelize;
  baseUrl: string;
  token: string;
  systemId: string;
  now: number;
  repeats: number;
}) {
  const repository = createReadingsRepository(options.sequelize);
  const results: { label: string; apiMs: number; sqlMs: number; points: number }[] = [];
  for (const range of HISTORY_RANGES) {
    const to = new Date(options.now);
    const from = new Date(options.now - range.ms);
    const bucketMs = Math.ceil(range.ms / POINT_BUDGET);
    const sql = async () => {
      const started = performance.now();
      const points = await repository.listDownsampled(options.systemId, from, to, bucketMs, POINT_BUDGET);
      return { ms: performance.now() - started, points: points.length };
    };
    const url = `${options.baseUrl}/api/systems/${options.systemId}/readings?from=${from.toISOString()}&to=${to.toISOString()}`;
    const api = async () => {
      const started = performance.now();
      const response = await fetch(url, { headers: { authorization: `Bearer ${options.token}` } });
      const body = (await response.json()) as { columns: { measuredAt: number[] } };
      if (!response.ok) throw new Error(`history answered ${response.status}`);
      return { ms: performance.now() - started, points: body.columns.measuredAt.length };
    };
    await sql();
    await api();
    const sqlRuns: number[] = [];
    const apiRuns: number[] = [];
    let points = 0;
    for (let i = 0; i < options.repeats; i++) {
      sqlRuns.push((await sql()).ms);
      const a = await api();
      apiRuns.push(a.ms);
      points = a.points;
    }
    results.push({ label: range.label, apiMs: median(apiRuns), sqlMs: median(sqlRuns), points });
  }
  return results;
}
