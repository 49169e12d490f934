import { FlagEvent } from './flag-event';
import { FlagSignal, FlagTrack, stepFlagTrack } from './flag-tracker';

// A low-is-bad signal with a start threshold of 20 and a release threshold of 23 (3 points of hysteresis).
function lowSignal(value: number): FlagSignal {
  return {
    trigger: value < 10 ? 'critical' : value < 20 ? 'warning' : undefined,
    holds: value < 23,
    value,
    unit: '%',
    worse: 'low',
  };
}

function run(values: number[], minimumMs: number, stepMs = 10_000, releaseMs = 0): FlagEvent[] {
  let track: FlagTrack | undefined;
  const events: FlagEvent[] = [];
  values.forEach((value, i) => {
    const step = stepFlagTrack('low-charge', track, lowSignal(value), i * stepMs, minimumMs, releaseMs);
    track = step.track;
    events.push(...step.events);
  });
  return events;
}

describe('stepFlagTrack', () => {
  it('keeps an active flag through a lapse shorter than the release delay', () => {
    // Active, then clear for 30 s, then low again: with a 60 s release delay that is one episode.
    const events = run([15, 15, 30, 30, 30, 15, 15], 0, 10_000, 60_000);
    expect(events.map((e) => e.transition)).toEqual(['start']);
  });

  it('ends an active flag once its condition has stayed clear for the release delay', () => {
    const events = run([15, 15, ...Array(8).fill(30)], 0, 10_000, 60_000);
    expect(events.map((e) => e.transition)).toEqual(['start', 'end']);
    // Clear from t = 20 s; the end is at the first reading 60 s later, t = 80 s.
    expect(events[1].at).toBe(80_000);
  });

  it('gives one start and one end for a value dithering around its threshold', () => {
    const dither = Array.from({ length: 100 }, (_, i) => (i % 2 === 0 ? 19.5 : 20.5));
    const events = run([30, ...dither, 30], 0);
    expect(events.map((e) => e.transition)).toEqual(['start', 'end']);
  });

  it('starts nothing for a dip shorter than the minimum duration', () => {
    expect(run([30, 15, 15, 15, 30, 30], 60_000)).toEqual([]);
  });

  it('starts once the condition has held for the minimum duration', () => {
    const events = run([30, ...Array(8).fill(15)], 60_000);
    expect(events).toHaveLength(1);
    // The first 15 at t = 10 s; 60 s later is t = 70 s
    expect(events[0]).toMatchObject({ transition: 'start', severity: 'warning', at: 70_000, value: 15 });
  });

  it('escalates to critical as a separate event and ends at the release threshold with the peak', () => {
    const events = run([30, 15, 15, 8, 8, 6, 12, 21, 24], 10_000);
    expect(events.map((e) => [e.transition, e.severity])).toEqual([
      ['start', 'warning'],
      ['escalate', 'critical'],
      ['end', 'critical'],
    ]);
    expect(events[2]).toMatchObject({ value: 24, peak: 6 });
  });
});
