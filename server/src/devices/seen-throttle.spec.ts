import { createSeenThrottle } from './seen-throttle';

describe('seen throttle', () => {
  let clock: number;
  let writes: Map<string, number>[];
  const throttle = (maxDevices?: number) =>
    createSeenThrottle({
      write: async (lastSeen) => {
        writes.push(new Map(lastSeen));
      },
      onError: () => undefined,
      now: () => clock,
      intervalMs: 30_000,
      maxDevices,
    });
  beforeEach(() => {
    jest.useFakeTimers();
    clock = 1_000_000;
    writes = [];
  });
  afterEach(() => jest.useRealTimers());

  it('writes a device at once the first time, then waits out the interval', async () => {
    const seen = throttle();
    await seen.markSeen(new Map([['a', 100]]));
    clock += 1000;
    await seen.markSeen(new Map([['a', 1100]]));
    expect(writes).toEqual([new Map([['a', 100]])]);
    clock += 29_000;
    await seen.markSeen(new Map([['a', 30_100]]));
    expect(writes).toEqual([new Map([['a', 100]]), new Map([['a', 30_100]])]);
    await seen.close();
  });

  it('writes what waited within one interval even when the device stops reporting', async () => {
    const seen = throttle();
    await seen.markSeen(new Map([['a', 100]]));
    await seen.markSeen(new Map([['a', 900]]));
    await seen.markSeen(new Map([['a', 500]])); // an older reading arriving late never moves it back
    clock += 30_000;
    jest.advanceTimersByTime(30_000);
    expect(writes).toEqual([new Map([['a', 100]]), new Map([['a', 900]])]);
    jest.advanceTimersByTime(30_000);
    expect(writes).toHaveLength(2);
    await seen.close();
  });

  it('writes the waiting devices at close', async () => {
    const seen = throttle();
    await seen.markSeen(new Map([['a', 100]]));
    await seen.markSeen(
      new Map([
        ['a', 200],
        ['b', 300],
      ]),
    );
    await seen.close();
    expect(writes).toEqual([new Map([['a', 100]]), new Map([['b', 300]]), new Map([['a', 200]])]);
  });

  it('forgets the oldest devices past its bound and writes those again at once', async () => {
    const seen = throttle(2);
    for (const id of ['a', 'b', 'c']) await seen.markSeen(new Map([[id, 1]]));
    await seen.markSeen(new Map([['a', 2]]));
    await seen.markSeen(new Map([['c', 2]]));
    expect(writes.map((w) => [...w.keys()].join())).toEqual(['a', 'b', 'c', 'a']);
    await seen.close();
  });

  it('goes on after a failed write', async () => {
    const errors: unknown[] = [];
    const seen = createSeenThrottle({
      write: () => Promise.reject(new Error('database away')),
      onError: (error) => errors.push(error),
      now: () => clock,
    });
    await expect(seen.markSeen(new Map([['a', 1]]))).resolves.toBeUndefined();
    expect(errors).toHaveLength(1);
    await seen.close();
  });
});
