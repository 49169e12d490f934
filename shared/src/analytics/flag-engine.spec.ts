import { BatteryReading } from '../telemetry/reading';
import { resolveBatterySetup } from './battery-setup';
import { FlagEvent } from './flag-event';
import { activeFlags, checkSilence, FlagState, stepFlags } from './flag-engine';
import { ChargeSourceRating, FlagSettings } from './flag-settings';
import { defaultFlagThresholds } from './flag-thresholds';

const start = Date.UTC(2026, 11, 2, 18, 0, 0);
const battery = resolveBatterySetup({
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  usableCapacityAh: 100,
});
const sources: ChargeSourceRating[] = [
  { id: 'dcdc', kind: 'dc-dc', ratedCurrentA: 30 },
  { id: 'roof', kind: 'solar', ratedCurrentA: 30 },
];
const settings: FlagSettings = { battery, thresholds: defaultFlagThresholds('lifepo4', 12, 100), sources };

/** What differs from a quiet evening (a 5 A load on a two-thirds-full LiFePO4 bank at 20 °C) during a stretch. */
interface Step {
  reading?: Partial<BatteryReading>;
  stateOfCharge?: number;
  disagreement?: number;
}

/** Feeds `seconds` of identical readings, one every `every` seconds, after `state`; collects the events. */
function feed(
  steps: { seconds: number; step: Step }[],
  every = 10,
  base: { state?: FlagState; t?: number; flagSettings?: FlagSettings } = {},
) {
  let state = base.state;
  let t = base.t ?? 0;
  const events: FlagEvent[] = [];
  for (const { seconds, step } of steps) {
    for (let s = 0; s < seconds; s += every, t += every) {
      const reading: BatteryReading = {
        measuredAt: start + t * 1000,
        voltage: 13.2,
        current: -5,
        temperature: 20,
        ...step.reading,
      };
      const estimate = { stateOfCharge: step.stateOfCharge ?? 66, disagreement: step.disagreement };
      const result = stepFlags(state, { reading, estimate, settings: base.flagSettings ?? settings });
      state = result.state;
      events.push(...result.events);
    }
  }
  return { state: state as FlagState, events, t };
}

const kinds = (events: FlagEvent[]) => events.map((e) => `${e.kind}:${e.transition}:${e.severity}`);

describe('stepFlags', () => {
  it('raises nothing on a normal evening, a normal charge or a rest', () => {
    const { events, state } = feed([
      { seconds: 3600, step: {} },
      {
        seconds: 3600,
        step: { reading: { current: 25, voltage: 13.6, sourceCurrents: { dcdc: 25, roof: 3 } } },
      },
      { seconds: 3600, step: { reading: { current: 0, voltage: 13.3 }, stateOfCharge: 90, disagreement: 4 } },
    ]);
    expect(events).toEqual([]);
    expect(activeFlags(state)).toEqual([]);
  });

  it('flags low charge, escalates it and ends it after recovery past the release level', () => {
    const { events } = feed([
      { seconds: 60, step: { stateOfCharge: 30 } },
      { seconds: 120, step: { stateOfCharge: 15 } },
      { seconds: 120, step: { stateOfCharge: 8 } },
      { seconds: 120, step: { stateOfCharge: 25 } },
    ]);
    expect(kinds(events)).toEqual([
      'low-charge:start:warning',
      'low-charge:escalate:critical',
      'low-charge:end:critical',
    ]);
    expect(events[2]).toMatchObject({ peak: 8, unit: '%' });
  });

  it('judges low voltage on the load-compensated voltage', () => {
    // Thevenin model of a battery (general reference): V_open ≈ V_terminal + I·R; 11.5 V + 100 A × 8 mΩ = 12.3 V
    const heavyLoad = feed([{ seconds: 120, step: { reading: { voltage: 11.5, current: -100 } } }]);
    expect(heavyLoad.events.filter((e) => e.kind === 'low-voltage')).toEqual([]);
    // 11.0 V + 10 A × 8 mΩ = 11.08 V, below the 11.6 V critical level (≈2.9 V per cell, from memory)
    const flat = feed([{ seconds: 60, step: { reading: { voltage: 11.0, current: -10 } } }]);
    expect(kinds(flat.events.filter((e) => e.kind === 'low-voltage'))).toEqual([
      'low-voltage:start:critical',
    ]);
    expect(flat.events[0].value).toBeCloseTo(11.08, 9);
  });

  it('flags charging a LiFePO4 bank below 0 °C, but not a cold bank at rest or on load', () => {
    // LiFePO4 must not be charged below 0 °C (cell datasheets, common practice; from memory)
    const charging = feed([
      { seconds: 60, step: { reading: { temperature: -2, current: 10, voltage: 13.5 } } },
    ]);
    expect(kinds(charging.events)).toEqual(['cold-charging:start:critical']);
    const idle = feed([
      { seconds: 600, step: { reading: { temperature: -2, current: 0 } } },
      { seconds: 600, step: { reading: { temperature: -2, current: -8 } } },
      { seconds: 600, step: { reading: { temperature: 3, current: 10, voltage: 13.5 } } },
    ]);
    expect(idle.events).toEqual([]);
  });

  it('lets lead-acid charge at −2 °C', () => {
    const agm = resolveBatterySetup({
      chemistry: 'agm',
      nominalVoltage: 12,
      ratedCapacityAh: 100,
      usableCapacityAh: 50,
    });
    const agmSettings = { battery: agm, thresholds: defaultFlagThresholds('agm', 12, 100) };
    const { events } = feed(
      [{ seconds: 600, step: { reading: { temperature: -2, current: 10, voltage: 13.8 } } }],
      10,
      {
        flagSettings: agmSettings,
      },
    );
    expect(events).toEqual([]);
  });

  it('warns that charging is heading for the cold limit before it gets there', () => {
    // 8 °C falling 6 °C per hour while charging at 10 A: 0 °C is reached after 80 minutes.
    const steps = Array.from({ length: 100 }, (_, minute) => ({
      seconds: 60,
      step: { reading: { temperature: 8 - minute * 0.1, current: 10, voltage: 13.5 } },
    }));
    const { events } = feed(steps);
    const ahead = events.find((e) => e.kind === 'cold-charge-ahead' && e.transition === 'start');
    const cold = events.find((e) => e.kind === 'cold-charging' && e.transition === 'start');
    expect(ahead).toBeDefined();
    expect(cold).toBeDefined();
    expect(ahead!.at).toBeLessThan(cold!.at);
    // It must give real warning: at least 15 minutes before 0 °C (80 min after the start).
    expect(ahead!.at).toBeLessThanOrEqual(start + 65 * 60_000);
    expect(events.some((e) => e.kind === 'cold-charge-ahead' && e.transition === 'end')).toBe(true);
  });

  it('does not warn of cold ahead for a bank steady at 4 °C', () => {
    const { events } = feed([
      { seconds: 3600, step: { reading: { temperature: 4, current: 10, voltage: 13.5 } } },
    ]);
    expect(events).toEqual([]);
  });

  it('flags over-temperature and escalates it', () => {
    const { events } = feed([
      { seconds: 120, step: { reading: { temperature: 52 } } },
      { seconds: 120, step: { reading: { temperature: 61 } } },
      { seconds: 120, step: { reading: { temperature: 40 } } },
    ]);
    expect(kinds(events)).toEqual([
      'over-temperature:start:warning',
      'over-temperature:escalate:critical',
      'over-temperature:end:critical',
    ]);
  });

  it('flags a discharge above the BMS rating held beyond a surge, not a short surge', () => {
    const surge = feed([
      { seconds: 10, step: { reading: { current: -140, voltage: 12.9 } } },
      { seconds: 60, step: {} },
    ]);
    expect(surge.events).toEqual([]);
    const sustained = feed([{ seconds: 30, step: { reading: { current: -120, voltage: 12.9 } } }]);
    expect(kinds(sustained.events)).toEqual(['over-discharge:start:warning']);
    expect(sustained.events[0]).toMatchObject({ value: 120, unit: 'A' });
  });

  it('suspects a BMS cut-off when current collapses from a stressed pack, not when a load is switched off', () => {
    const cutOff = feed([
      { seconds: 30, step: { reading: { current: -60, voltage: 11.4 } } },
      { seconds: 30, step: { reading: { current: 0, voltage: 12.6 } } },
    ]);
    expect(kinds(cutOff.events)).toEqual(['bms-cutoff-suspected:start:critical']);
    const switchedOff = feed([
      { seconds: 30, step: { reading: { current: -60, voltage: 12.9 } } },
      { seconds: 30, step: { reading: { current: 0, voltage: 13.2 } } },
    ]);
    expect(switchedOff.events).toEqual([]);
  });

  it('suspects a BMS cut-off when the pack voltage collapses to almost nothing, and ends when it returns', () => {
    const { events } = feed([
      { seconds: 30, step: {} },
      { seconds: 30, step: { reading: { current: 0, voltage: 0.4 } } },
      { seconds: 30, step: { reading: { current: 5, voltage: 13.4 } } },
    ]);
    expect(kinds(events)).toEqual([
      'bms-cutoff-suspected:start:critical',
      'bms-cutoff-suspected:end:critical',
    ]);
  });

  it('flags a DC-DC charger delivering a third of its rating in bulk, naming the source', () => {
    const { events } = feed([
      { seconds: 660, step: { reading: { current: 10, voltage: 13.4, sourceCurrents: { dcdc: 10 } } } },
    ]);
    expect(kinds(events)).toEqual(['charger-under-delivering:start:warning']);
    expect(events[0]).toMatchObject({ sourceId: 'dcdc', unit: '%' });
    expect(events[0].value).toBeCloseTo(100 / 3, 9);
  });

  it('does not judge solar, a charger in absorption, or a short dip', () => {
    const { events } = feed([
      { seconds: 1200, step: { reading: { current: 5, voltage: 13.4, sourceCurrents: { roof: 5 } } } },
      { seconds: 1200, step: { reading: { current: 10, voltage: 14.15, sourceCurrents: { dcdc: 10 } } } },
      { seconds: 300, step: { reading: { current: 10, voltage: 13.4, sourceCurrents: { dcdc: 10 } } } },
      { seconds: 600, step: { reading: { current: 29, voltage: 13.5, sourceCurrents: { dcdc: 29 } } } },
    ]);
    expect(events).toEqual([]);
  });

  it('flags a lasting disagreement between the reported and estimated state of charge', () => {
    const { events } = feed([{ seconds: 660, step: { disagreement: 20 } }]);
    expect(kinds(events)).toEqual(['soc-disagreement:start:warning']);
  });

  it('ignores a reading older than the newest seen', () => {
    const { state, t } = feed([{ seconds: 60, step: {} }]);
    const stale = stepFlags(state, {
      reading: { measuredAt: start + (t - 30) * 1000, voltage: 0, current: 0, temperature: 90 },
      estimate: { stateOfCharge: 1 },
      settings,
    });
    expect(stale).toEqual({ state, events: [] });
  });
});

describe('checkSilence', () => {
  it('starts device-silent after the configured minutes, once, and the next reading ends it', () => {
    const { state, t } = feed([{ seconds: 60, step: {} }]);
    const last = start + (t - 10) * 1000;
    expect(checkSilence(state, last + 9 * 60_000).events).toEqual([]);
    const silent = checkSilence(state, last + 11 * 60_000);
    expect(kinds(silent.events)).toEqual(['device-silent:start:warning']);
    expect(silent.events[0].value).toBeCloseTo(11, 9);
    expect(activeFlags(silent.state).map((f) => f.kind)).toEqual(['device-silent']);
    expect(checkSilence(silent.state, last + 20 * 60_000).events).toEqual([]);
    const back = feed([{ seconds: 10, step: {} }], 10, { state: silent.state, t: t + 30 * 60 });
    expect(kinds(back.events)).toEqual(['device-silent:end:warning']);
    expect(activeFlags(back.state)).toEqual([]);
  });

  it('says nothing before the first reading', () => {
    expect(checkSilence({ tracks: {}, silentAfterMs: 600_000, memory: {} }, start).events).toEqual([]);
  });
});

describe('activeFlags', () => {
  it('lists the active flags, critical first, with their peaks', () => {
    const { state } = feed([
      { seconds: 120, step: { stateOfCharge: 15, reading: { temperature: 52 } } },
      { seconds: 120, step: { stateOfCharge: 7, reading: { temperature: 53 } } },
    ]);
    expect(activeFlags(state)).toEqual([
      { kind: 'low-charge', severity: 'critical', since: start + 0, peakValue: 7, unit: '%' },
      { kind: 'over-temperature', severity: 'warning', since: start + 0, peakValue: 53, unit: '°C' },
    ]);
  });
});
