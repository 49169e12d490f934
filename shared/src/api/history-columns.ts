import type { HistoryPoint } from './api-contract';

/**
 * Every field a history point can carry, in the order the columns are written, each with its own reader: one
 * property read per function stays monomorphic, where `point[field]` over thirteen names would not (it cost
 * more than writing the JSON).
 */
const READERS = {
  measuredAt: (point) => point.measuredAt,
  voltage: (point) => point.voltage,
  current: (point) => point.current,
  temperature: (point) => point.temperature,
  stateOfCharge: (point) => point.stateOfCharge,
  voltageMin: (point) => point.voltageMin,
  voltageMax: (point) => point.voltageMax,
  currentMin: (point) => point.currentMin,
  currentMax: (point) => point.currentMax,
  ahIn: (point) => point.ahIn,
  ahOut: (point) => point.ahOut,
  whIn: (point) => point.whIn,
  whOut: (point) => point.whOut,
} satisfies Record<keyof HistoryPoint, (point: HistoryPoint) => number | null | undefined>;

const FIELDS = Object.keys(READERS) as (keyof typeof READERS)[];

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
    const read = READERS[field];
    // A column is written only when some point has the field, so a raw series has no energy columns.
    if (!points.some((point) => read(point) != null)) continue;
    columns[field] = points.map((point) => read(point) ?? null);
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
