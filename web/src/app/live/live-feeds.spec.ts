import type { AlertEvent, ReceivedReading, SystemStatus } from '@cellwarden/shared';
import { foldLiveStep } from './live-feeds';

const reading = (measuredAt: number, voltage: number): ReceivedReading => ({
  measuredAt,
  receivedAt: measuredAt,
  voltage,
  current: -3,
  temperature: 15,
});
const status = (latest: ReceivedReading | null): SystemStatus => ({
  systemId: 'van-1',
  latestReading: latest,
  derived: null,
  activeAlerts: [],
  monitors: [],
});
const event = (r: ReceivedReading) => ({
  kind: 'event' as const,
  event: { type: 'reading' as const, reading: r, derived: null },
});
const start = { state: null, early: [], seeded: false };

describe('live states folding (stream subscribed alongside the status)', () => {
  it('shows a stream reading that arrives before the status, then folds it in after the status', () => {
    let folding = foldLiveStep(start, event(reading(2000, 13.0)));
    expect(folding.state?.reading?.voltage).toBe(13.0);
    folding = foldLiveStep(folding, { kind: 'seed', status: status(reading(1000, 13.2)) });
    expect(folding.state?.reading?.voltage).toBe(13.0);
    expect(folding.early).toEqual([]);
  });

  it('waits for the status when only an alert came first', () => {
    const alert: AlertEvent = {
      id: 'a1',
      systemId: 'van-1',
      kind: 'low-voltage',
      severity: 'warning',
      startedAt: 900,
      endedAt: null,
      peakValue: 11.8,
      unit: 'V',
      acknowledgedAt: null,
      acknowledgedBy: null,
      note: null,
    };
    let folding = foldLiveStep(start, { kind: 'event', event: { type: 'alert', alert } });
    expect(folding.state).toBeNull();
    folding = foldLiveStep(folding, { kind: 'seed', status: status(reading(1000, 13.2)) });
    expect(folding.state?.flags.map((f) => f.kind)).toEqual(['low-voltage']);
  });

  it('keeps the status reading when the early event is older than it', () => {
    let folding = foldLiveStep(start, event(reading(500, 12.6)));
    folding = foldLiveStep(folding, { kind: 'seed', status: status(reading(1000, 13.2)) });
    expect(folding.state?.reading?.voltage).toBe(13.2);
  });

  it('applies events directly once the status is in', () => {
    let folding = foldLiveStep(start, { kind: 'seed', status: status(null) });
    folding = foldLiveStep(folding, event(reading(3000, 12.9)));
    expect(folding.state?.reading?.voltage).toBe(12.9);
  });

  it('ends with an access-ended event that came before the status', () => {
    let folding = foldLiveStep(start, { kind: 'event', event: { type: 'access-ended' } });
    folding = foldLiveStep(folding, { kind: 'seed', status: status(reading(1000, 13.2)) });
    expect(folding.state?.accessEnded).toBe(true);
  });
});
