import { isOffline } from './offline-schedule';

const start = Date.UTC(2026, 0, 1);
const minute = (m: number) => start + m * 60_000;

describe('offline schedule', () => {
  it('drops off every N minutes for M minutes, starting after the first N', () => {
    const schedule = { everyMinutes: 30, forMinutes: 5 };
    const offline = Array.from({ length: 70 }, (_, m) => m).filter((m) =>
      isOffline(schedule, start, minute(m)),
    );
    expect(offline).toEqual([30, 31, 32, 33, 34, 60, 61, 62, 63, 64]);
  });

  it('stays online without a schedule', () => {
    expect(isOffline(undefined, start, minute(45))).toBe(false);
  });
});
