import type { HistoryPoint } from './api-contract';
import { fromHistoryColumns, toHistoryColumns } from './history-columns';

const raw: HistoryPoint[] = [
  { measuredAt: 1_000, voltage: 13.3, current: -2.5, temperature: 4, stateOfCharge: 81 },
  { measuredAt: 3_000, voltage: 13.28, current: -2.75, temperature: 3.9 },
  { measuredAt: 5_000, voltage: 13.25, current: 0, temperature: 3.8, stateOfCharge: 80.5 },
];

const rollup: HistoryPoint[] = [
  {
    measuredAt: 60_000,
    voltage: 13.1,
    current: 5,
    temperature: -1,
    stateOfCharge: 70,
    voltageMin: 13,
    voltageMax: 13.2,
    currentMin: 4,
    currentMax: 6,
    ahIn: 0.083,
    ahOut: 0,
    whIn: 1.092,
    whOut: 0,
  },
];

describe('history series as columns', () => {
  it('writes one array per field, in point order, with null where a point lacks a value', () => {
    expect(toHistoryColumns(raw)).toEqual({
      measuredAt: [1_000, 3_000, 5_000],
      voltage: [13.3, 13.28, 13.25],
      current: [-2.5, -2.75, 0],
      temperature: [4, 3.9, 3.8],
      stateOfCharge: [81, null, 80.5],
    });
  });

  it('leaves out a column no point has (a raw series carries no extremes or energy)', () => {
    const columns = toHistoryColumns(raw);
    expect(Object.keys(columns)).not.toContain('ahIn');
    expect(Object.keys(toHistoryColumns(raw.map(({ stateOfCharge: _, ...p }) => p)))).not.toContain(
      'stateOfCharge',
    );
  });

  it('reads back exactly the points it was given, raw or from rollups', () => {
    expect(fromHistoryColumns(toHistoryColumns(raw))).toEqual(raw);
    expect(fromHistoryColumns(toHistoryColumns(rollup))).toEqual(rollup);
  });

  it('treats a null from the database like a missing value, and keeps zeros', () => {
    const fromDatabase = [{ ...raw[1], stateOfCharge: null as unknown as number }];
    const [point] = fromHistoryColumns(toHistoryColumns(fromDatabase));
    expect(point).not.toHaveProperty('stateOfCharge');
    expect(fromHistoryColumns(toHistoryColumns([raw[2]]))[0].current).toBe(0);
  });

  it('writes an empty series as empty time column', () => {
    expect(toHistoryColumns([])).toEqual({ measuredAt: [] });
    expect(fromHistoryColumns({ measuredAt: [] })).toEqual([]);
  });

  it('is smaller on the wire than the same points as objects', () => {
    const series = Array.from({ length: 2000 }, (_, k) => ({ ...raw[0], measuredAt: k * 2000 }));
    expect(JSON.stringify(toHistoryColumns(series)).length).toBeLessThan(JSON.stringify(series).length / 2);
  });
});
