import type { BatteryReading } from '@cellwarden/shared';
import { createMemoryLogger } from '../logger';
import type { ReadingRow, ReadingsRepository } from '../telemetry/readings-repository';
import { createBatchWriter, IngestQueueFullError } from './batch-writer';

const reading = (measuredAt: number): BatteryReading => ({
  measuredAt,
  voltage: 13.1,
  current: 2,
  temperature: 10,
});
const rowsOf = (systemId: string, times: number[]): ReadingRow[] =>
  times.map((t) => ({ systemId, deviceId: `${systemId}-monitor`, reading: reading(t) }));

/** A repository whose writes the test completes (or fails) by hand, in the order they were asked for. */
function heldRepository() {
  const writes: { rows: readonly ReadingRow[]; done: () => void; fail: () => void }[] = [];
  const repository = {
    insertBatch: (rows: readonly ReadingRow[]) =>
      new Promise<ReadingRow[]>((resolve, reject) =>
        writes.push({ rows, done: () => resolve([...rows]), fail: () => reject(new Error('database away')) }),
      ),
  } as unknown as ReadingsRepository;
  return { repository, writes };
}

function writerOver(repository: ReadingsRepository, options: { batchSize?: number; lanes?: number } = {}) {
  const stored: ReadingRow[] = [];
  const writer = createBatchWriter({
    repository,
    logger: createMemoryLogger(),
    batchSize: options.batchSize ?? 500,
    retryMs: 100,
    queueLimit: 1000,
    lanes: options.lanes ?? 2,
    onStored: (rows) => stored.push(...rows),
  });
  return { writer, stored };
}

beforeEach(() => jest.useFakeTimers());
afterEach(() => jest.useRealTimers());

it('writes a pack at once when nothing is in flight, as one batch', async () => {
  const { repository, writes } = heldRepository();
  const { writer, stored } = writerOver(repository);
  const written = writer.write(rowsOf('a', [1, 2, 3]));
  await jest.advanceTimersByTimeAsync(0);
  expect(writes.map((w) => w.rows.length)).toEqual([3]);
  writes[0].done();
  await written;
  expect(stored.map((r) => r.reading.measuredAt)).toEqual([1, 2, 3]);
});

it('gathers what arrives during a write into the next batch, no larger than the batch size', async () => {
  const { repository, writes } = heldRepository();
  const { writer } = writerOver(repository, { batchSize: 4, lanes: 1 });
  const first = writer.write(rowsOf('a', [1]));
  await jest.advanceTimersByTimeAsync(0);
  const later = [2, 3, 4, 5, 6, 7].map((t) => writer.write(rowsOf('a', [t])));
  await jest.advanceTimersByTimeAsync(0);
  expect(writes.length).toBe(1);
  writes[0].done();
  await first;
  await jest.advanceTimersByTimeAsync(0);
  writes[1].done();
  await jest.advanceTimersByTimeAsync(0);
  writes[2].done();
  await Promise.all(later);
  expect(writes.map((w) => w.rows.map((r) => r.reading.measuredAt))).toEqual([[1], [2, 3, 4, 5], [6, 7]]);
});

it('acknowledges a pack split over two batches only once both are committed', async () => {
  const { repository, writes } = heldRepository();
  const { writer } = writerOver(repository, { batchSize: 3, lanes: 1 });
  let acknowledged = false;
  const written = writer.write(rowsOf('a', [1, 2, 3, 4, 5])).then(() => (acknowledged = true));
  await jest.advanceTimersByTimeAsync(0);
  writes[0].done();
  await jest.advanceTimersByTimeAsync(0);
  expect({ batches: writes.map((w) => w.rows.length), acknowledged }).toEqual({
    batches: [3, 2],
    acknowledged: false,
  });
  writes[1].done();
  await written;
  expect(writer.queued).toBe(0);
});

it('writes different systems concurrently but keeps each system in order', async () => {
  const { repository, writes } = heldRepository();
  const { writer } = writerOver(repository, { lanes: 2 });
  // Ids chosen to land in different lanes (FNV-1a of the id, modulo 2).
  const done = [writer.write(rowsOf('system-1', [1])), writer.write(rowsOf('system-2', [1]))];
  await jest.advanceTimersByTimeAsync(0);
  expect(writes.map((w) => w.rows[0].systemId).sort()).toEqual(['system-1', 'system-2']);
  const again = writer.write(rowsOf('system-1', [2]));
  await jest.advanceTimersByTimeAsync(0);
  expect(writes.length).toBe(2);
  writes.forEach((w) => w.done());
  await Promise.all(done);
  await jest.advanceTimersByTimeAsync(0);
  expect(writes[2].rows.map((r) => [r.systemId, r.reading.measuredAt])).toEqual([['system-1', 2]]);
  writes[2].done();
  await again;
});

it('acknowledges nothing until a failed batch is committed on a later try', async () => {
  const { repository, writes } = heldRepository();
  const { writer } = writerOver(repository);
  let acknowledged = false;
  const written = writer.write(rowsOf('a', [1, 2])).then(() => (acknowledged = true));
  await jest.advanceTimersByTimeAsync(0);
  writes[0].fail();
  await jest.advanceTimersByTimeAsync(50);
  expect({ tries: writes.length, acknowledged }).toEqual({ tries: 1, acknowledged: false });
  await jest.advanceTimersByTimeAsync(60);
  expect(writes.length).toBe(2);
  writes[1].done();
  await written;
  expect({ acknowledged, queued: writer.queued }).toEqual({ acknowledged: true, queued: 0 });
});

it('refuses at once what would overfill the queue', async () => {
  const { repository } = heldRepository();
  const { writer } = writerOver(repository);
  void writer
    .write(
      rowsOf(
        'a',
        Array.from({ length: 990 }, (_, i) => i),
      ),
    )
    .catch(() => undefined);
  await expect(
    writer.write(
      rowsOf(
        'b',
        Array.from({ length: 20 }, (_, i) => i),
      ),
    ),
  ).rejects.toBeInstanceOf(IngestQueueFullError);
  writer.close();
});

it('announces only the rows the repository reports as new, and acknowledges the whole pack', async () => {
  // A redelivered pack: the database already held the first two readings (ON CONFLICT DO NOTHING).
  const repository = {
    insertBatch: async (rows: readonly ReadingRow[]) => rows.filter((r) => r.reading.measuredAt > 2),
  } as unknown as ReadingsRepository;
  const { writer, stored } = writerOver(repository);
  const written = writer.write(rowsOf('a', [1, 2, 3]));
  await jest.advanceTimersByTimeAsync(0);
  await written;
  expect(stored.map((r) => r.reading.measuredAt)).toEqual([3]);
});

it('acknowledges a stored batch even when its listener throws, and logs why', async () => {
  const repository = {
    insertBatch: async (rows: readonly ReadingRow[]) => [...rows],
  } as unknown as ReadingsRepository;
  const logger = createMemoryLogger();
  const writer = createBatchWriter({
    repository,
    logger,
    batchSize: 500,
    retryMs: 100,
    queueLimit: 1000,
    onStored: () => {
      throw new Error('listener broke');
    },
  });
  const written = writer.write(rowsOf('a', [1]));
  await jest.advanceTimersByTimeAsync(0);
  await expect(written).resolves.toBeUndefined();
  expect(logger.entries.map((e) => e.message)).toEqual(['stored readings not announced']);
});

// A batch in flight at close still goes live once committed; its pack is not acknowledged either way, and its
// redelivery is then a duplicate the insert skips.
it('on close leaves everything unacknowledged (the broker redelivers it) and writes no more', async () => {
  const { repository, writes } = heldRepository();
  const { writer, stored } = writerOver(repository, { lanes: 1 });
  const first = writer.write(rowsOf('a', [1]));
  await jest.advanceTimersByTimeAsync(0);
  const waiting = writer.write(rowsOf('a', [2]));
  writer.close();
  await expect(waiting).rejects.toThrow('ingest stopped');
  await expect(first).rejects.toThrow('ingest stopped');
  writes[0].done();
  await jest.advanceTimersByTimeAsync(200);
  expect({ tries: writes.length, stored: stored.length, queued: writer.queued }).toEqual({
    tries: 1,
    stored: 1,
    queued: 0,
  });
});
