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

  it('keeps the headline on the lead monitor and gives a second monitor of the bank its own row', () => {
    const monitor = (deviceId: string, lead: boolean, at: number, voltage: number) => ({
      deviceId,
      label: lead ? 'Main shunt' : 'BMS monitor',
      lead,
      reading: { ...reading(at, voltage), deviceId },
    });
    let state = seedLiveState({
      systemId: 'van-1',
      latestReading: { ...reading(1000, 13.2), deviceId: 'shunt' },
      derived: derived(),
      activeAlerts: [],
      monitors: [monitor('shunt', true, 1000, 13.2), monitor('bms', false, 1500, 13.6)],
    });
    const event = (deviceId: string, at: number, voltage: number) =>
      ({ type: 'reading', reading: { ...reading(at, voltage), deviceId }, derived: null }) as const;
    // Interleaved: lead, second, lead, second — the headline reading only ever shows the lead's values.
    const voltages: number[] = [];
    for (const [device, at, volts] of [
      ['shunt', 2000, 13.21],
      ['bms', 2500, 13.61],
      ['shunt', 3000, 13.22],
      ['bms', 3500, 13.62],
    ] as const) {
      state = applyStreamEvent(state, event(device, at, volts));
      voltages.push(state.reading!.voltage);
    }
    expect(voltages).toEqual([13.21, 13.21, 13.22, 13.22]);
    expect(state.monitors.map((m) => [m.label, m.reading?.voltage])).toEqual([
      ['Main shunt', 13.22],
      ['BMS monitor', 13.62],
    ]);
    // A monitor the status did not know yet appears under its id.
    state = applyStreamEvent(state, event('new-one', 4000, 12.9));
    expect(state.monitors.map((m) => m.label)).toEqual(['Main shunt', 'BMS monitor', 'new-one']);
    expect(state.reading!.voltage).toBe(13.22);
  });
});
