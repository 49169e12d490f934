import type { AlertEvent, DerivedState, ReceivedReading, SystemStatus } from '@cellwarden/shared';
import { EMPTY_LIVE_STATE, applyStreamEvent, seedLiveState } from './live-state';

const reading = (measuredAt: number, voltage = 13.2): ReceivedReading => ({
  measuredAt,
  receivedAt: measuredAt,
  voltage,
  current: -3,
  temperature: 15,
});
const derived = (flags: DerivedState['activeFlags'] = []): DerivedState => ({
  stateOfCharge: 70,
  stateOfChargeSource: 'reported',
  hoursToEmpty: 20,
  hoursToFull: null,
  meanCurrent: -3,
  byMorning: null,
  activeFlags: flags,
});
const alert = (over: Partial<AlertEvent> = {}): AlertEvent => ({
  id: 'al-1',
  systemId: 'van-1',
  kind: 'low-charge',
  severity: 'warning',
  startedAt: 1000,
  endedAt: null,
  peakValue: 18,
  unit: '%',
  acknowledgedAt: null,
  acknowledgedBy: null,
  note: null,
  ...over,
});

describe('live state', () => {
  it('starts from the status with its flags and active alerts', () => {
    const status: SystemStatus = {
      systemId: 'van-1',
      latestReading: reading(1000),
      derived: derived([{ kind: 'over-temperature', severity: 'critical', since: 900, peakValue: 52 }]),
      activeAlerts: [alert()],
    };
    const state = seedLiveState(status);
    expect(state.reading?.voltage).toBe(13.2);
    expect(state.flags.map((f) => f.kind).sort()).toEqual(['low-charge', 'over-temperature']);
  });

  it('takes each newer reading with its derived state and learns the reporting interval', () => {
    let state = applyStreamEvent(EMPTY_LIVE_STATE, {
      type: 'reading',
      reading: reading(1000),
      derived: null,
    });
    state = applyStreamEvent(state, { type: 'reading', reading: reading(11_000, 13.0), derived: derived() });
    expect(state.reading?.voltage).toBe(13.0);
    expect(state.derived?.hoursToEmpty).toBe(20);
    expect(state.intervalMs).toBe(10_000);
  });

  it('ignores a reading older than the one shown', () => {
    let state = applyStreamEvent(EMPTY_LIVE_STATE, {
      type: 'reading',
      reading: reading(5000),
      derived: null,
    });
    state = applyStreamEvent(state, { type: 'reading', reading: reading(1000, 11.9), derived: null });
    expect(state.reading?.voltage).toBe(13.2);
  });

  it('adds a flag when an alert starts and drops it when the alert ends', () => {
    let state = applyStreamEvent(EMPTY_LIVE_STATE, { type: 'alert', alert: alert() });
    expect(state.flags.map((f) => f.kind)).toEqual(['low-charge']);
    state = applyStreamEvent(state, { type: 'alert', alert: alert({ endedAt: 2000 }) });
    expect(state.flags).toEqual([]);
  });

  it('stops changing once access has ended', () => {
    const ended = applyStreamEvent(EMPTY_LIVE_STATE, { type: 'access-ended' });
    const after = applyStreamEvent(ended, { type: 'reading', reading: reading(1000), derived: null });
    expect(after.accessEnded).toBe(true);
    expect(after.reading).toBeNull();
  });
});
