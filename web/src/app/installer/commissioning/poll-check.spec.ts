import type { CommissioningCheck } from '@cellwarden/shared';
import { of } from 'rxjs';
import { pollCheck } from './poll-check';

const running = (seconds: number) =>
  ({
    id: 'k1',
    status: 'running',
    progress: { phase: 'measuring', secondsMeasured: seconds, secondsNeeded: 60 },
  }) as CommissioningCheck;

describe('pollCheck', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('asks every 2 s and stops after the first finished answer', () => {
    const answers = [running(20), running(40), { ...running(60), status: 'passed' } as CommissioningCheck];
    const fetch = jest.fn(() => of(answers.shift()!));
    const seen: string[] = [];
    let completed = false;
    pollCheck(fetch).subscribe({ next: (c) => seen.push(c.status), complete: () => (completed = true) });
    jest.advanceTimersByTime(1999);
    expect(fetch).not.toHaveBeenCalled();
    jest.advanceTimersByTime(1);
    expect(fetch).toHaveBeenCalledTimes(1);
    jest.advanceTimersByTime(4000);
    expect(seen).toEqual(['running', 'running', 'passed']);
    expect(completed).toBe(true);
    jest.advanceTimersByTime(10_000);
    expect(fetch).toHaveBeenCalledTimes(3);
  });
});
