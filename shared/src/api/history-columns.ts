import type { HistoryPoint } from './api-contract';

/** Every field a history point can carry, in the order the columns are written. */
const FIELDS = [
  'measuredAt',
  'voltage',
  'current',
  'temperature',
  'stateOfCharge',
  'voltageMin',
  'voltageMax',
  'currentMin',
  'currentMax',
  'ahIn',
  'ahOut',
  'whIn',
  'whOut',
] as const satisfies readonly (keyof HistoryPoint)[];

type Field = (typeof FIELDS)[number];

/**
 * GET /api/systems/:id/readings as it travels: one array per field, the n-th entry of each belonging to the
 * n-th point. A series of 2,000 points would otherwise repeat every key 2,000 times; as columns it is about
 * half the bytes, and half the work to write and to read. A field no point carries has no column; a point
 * without a value where others have one holds null.
 */
export type HistoryColumns = { measuredAt: number[] } & Partial<Record<Field, (number | null)[]>>;

/** The points as columns (the server's side). */
export function toHistoryColumns(points: readonly HistoryPoint[]): HistoryColumns {
  const columns: Record<string, (number | null)[]> = { measuredAt: [] };
  for (const field of FIELDS) {
    // A column is written only when some point has the field, so a raw series has no energy columns.
    if (!points.some((point) => point[field] != null)) continue;
    columns[field] = points.map((point) => point[field] ?? null);
  }
  return columns as HistoryColumns;
}

/** The points again (the dashboard's side); a null entry leaves the field off that point. */
export function fromHistoryColumns(columns: HistoryColumns): HistoryPoint[] {
  const present = FIELDS.filter((field) => Array.isArray(columns[field]));
  return columns.measuredAt.map((_, index) => {
    const point: Partial<Record<Field, number>> = {};
    for (const field of present) {
      const value = columns[field]![index];
      if (value != null) point[field] = value;
    }
    return point as HistoryPoint;
  });
}
