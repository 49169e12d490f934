import type { BatteryReading, DerivedState } from '@cellwarden/shared';
import { createMemoryLogger } from '../logger';
import type { LiveEvent } from '../telemetry/readings-hub';
import type { ReadingRow } from '../telemetry/readings-repository';
import { createStoredReadingsFanout, receivedReading } from './stored-readings-fanout';

const RECEIVED = Date.UTC(2026, 11, 3, 12);
const reading = (measuredAt: number): BatteryReading => ({
  measuredAt,
  voltage: 13.1,
  current: 2,
  temperature: 10,
});
const row = (systemId: string, deviceId: string, t: number): ReadingRow => ({
  systemId,
  deviceId,
  reading: reading(t),
});

/** Analytics whose answers the test releases by hand, so the order of what goes live can be seen. */
function fakes(options: { markSeenFails?: boolean } = {}) {
  const checked: [string, number][] = [];
  const published: LiveEvent[] = [];
  const seen: Map<string, number>[] = [];
  const held: { row: ReadingRow; release: (derived: DerivedState | null) => void }[] = [];
  const logger = createMemoryLogger();
  const fanout = createStoredReadingsFanout({
    checks: { onReading: (systemId, r) => void checked.push([systemId, r.measuredAt]) },
    analytics: {
      processEach: (rows, onDerived) => {
        for (const r of rows) held.push({ row: r, release: (derived) => onDerived(r, derived) });
      },
    },
    hub: { publish: (event) => void published.push(event) },
    devices: {
      async markSeen(lastSeen) {
        seen.push(new Map(lastSeen));
        if (options.markSeenFails) throw new Error('database away');
      },
    },
    logger,
    now: () => RECEIVED,
  });
  return { fanout, checked, published, seen, held, logger };
}

const settle = () => new Promise((resolve) => setImmediate(resolve));

describe('stored readings fan-out', () => {
  it('gives every reading to the commissioning checks at once, before any analytics answer', () => {
    const { fanout, checked, published } = fakes();
    fanout([row('a', 'm1', 1), row('b', 'm2', 2)]);
    expect(checked).toEqual([
      ['a', 1],
      ['b', 2],
    ]);
    expect(published).toEqual([]);
  });

  it('publishes each reading with its derived state as soon as its own analytics are done', async () => {
    const { fanout, published, held } = fakes();
    fanout([row('a', 'm1', 1), row('b', 'm2', 2)]);
    expect(held.map((h) => h.row.systemId)).toEqual(['a', 'b']);
    const derived = { stateOfCharge: 71 } as unknown as DerivedState;
    held[1].release(derived);
    await settle();
    expect(published).toEqual([
      {
        systemId: 'b',
        message: {
          type: 'reading',
          systemId: 'b',
          reading: { ...reading(2), receivedAt: RECEIVED, deviceId: 'm2' },
          derived,
        },
      },
    ]);
    held[0].release(null);
    await settle();
    expect(published.map((p) => p.systemId)).toEqual(['b', 'a']);
  });

  it("moves each monitor's last seen to its newest measured time in the batch, once per batch", () => {
    const { fanout, seen } = fakes();
    fanout([row('a', 'm1', 5), row('a', 'm1', 3), row('b', 'm2', 2)]);
    expect(seen).toEqual([
      new Map([
        ['m1', 5],
        ['m2', 2],
      ]),
    ]);
  });

  it('logs a failed last-seen update and still publishes the readings', async () => {
    const { fanout, published, held, logger } = fakes({ markSeenFails: true });
    fanout([row('a', 'm1', 1)]);
    held[0].release(null);
    await settle();
    expect(published).toHaveLength(1);
    expect(logger.entries.map((e) => e.message)).toContain('last seen not updated');
  });
});

describe('receivedReading', () => {
  it('carries every field of the reading, with its arrival and monitor', () => {
    const full: Required<BatteryReading> = {
      measuredAt: 1,
      voltage: 13.1,
      current: -2.5,
      temperature: 10.5,
      stateOfCharge: 64.5,
      power: -32.75,
      sourceCurrents: { solar: 3.5, dcdc: 0 },
    };
    expect(receivedReading({ systemId: 'a', deviceId: 'm1', reading: full }, RECEIVED)).toEqual({
      ...full,
      receivedAt: RECEIVED,
      deviceId: 'm1',
    });
    expect(receivedReading(row('a', 'm1', 2), RECEIVED)).toEqual({
      ...reading(2),
      receivedAt: RECEIVED,
      deviceId: 'm1',
    });
  });
});
