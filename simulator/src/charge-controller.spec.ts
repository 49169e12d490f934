import { CHEMISTRY_PROFILES } from '@cellwarden/shared';
import { ChargerState, chargerSettingsFor, RESTART, stepCharger } from './charge-controller';
import { copperPairResistance } from './charge-sources';
import { PackState, stepPack, terminalVoltage } from './pack-model';

const pack: PackState = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  stateOfCharge: 40,
  temperature: 25,
  current: 0,
};
const settings = chargerSettingsFor(pack, 30, copperPairResistance(2, 10));

function charge(from: PackState, seconds: number) {
  let state: ChargerState = RESTART;
  let battery = from;
  const log: { stage: string; current: number; voltage: number }[] = [];
  for (let t = 0; t < seconds; t += 10) {
    const out = stepCharger(state, settings, battery, Infinity, 0, 10);
    state = out.state;
    battery = stepPack(battery, 10, out.current);
    log.push({ stage: state.stage, current: out.current, voltage: out.outputVoltage });
  }
  return log;
}

describe('three-stage charger', () => {
  it('takes its setpoints from the chemistry, scaled to the pack voltage', () => {
    const at24 = chargerSettingsFor({ ...pack, nominalVoltage: 24 }, 30, 0);
    expect(at24.absorptionVoltage).toBeCloseTo(CHEMISTRY_PROFILES.lifepo4.absorptionVoltage * 2, 9);
    expect(at24.floatVoltage).toBeCloseTo(CHEMISTRY_PROFILES.lifepo4.floatVoltage * 2, 9);
  });

  it('delivers its rating in bulk, then holds the absorption voltage while the current tapers, then floats', () => {
    const log = charge(pack, 4 * 3600);
    expect(log[0]).toMatchObject({ stage: 'bulk', current: 30 });
    const absorption = log.filter((s) => s.stage === 'absorption');
    expect(absorption.length).toBeGreaterThan(10);
    for (const step of absorption.slice(1)) expect(step.voltage).toBeCloseTo(settings.absorptionVoltage, 6);
    expect(absorption[absorption.length - 1].current).toBeLessThan(absorption[1].current / 2);
    expect(log[log.length - 1].stage).toBe('float');
    const stages = log.map((s) => s.stage).filter((stage, i, all) => stage !== all[i - 1]);
    expect(stages).toEqual(['bulk', 'absorption', 'float']);
  });

  it('gives less than its rating through a thin cable, which drops the difference', () => {
    const thin = { ...settings, cableResistance: copperPairResistance(3, 2.5) };
    const out = stepCharger(RESTART, { ...thin, ratedCurrent: 60 }, pack, Infinity, 0, 10);
    expect(out.current).toBeLessThan(60);
    const battery = terminalVoltage(pack, out.current);
    // Ohm's law over the cable pair: drop = I · R_cable.
    expect(out.outputVoltage - battery).toBeCloseTo(out.current * thin.cableResistance, 6);
    expect(out.outputVoltage - battery).toBeGreaterThan(0.5);
  });

  it('feeds the loads too, so the pack sees the charger current minus the loads', () => {
    const out = stepCharger(RESTART, settings, pack, Infinity, -8, 10);
    expect(out.current).toBe(30);
    const capped = stepCharger(RESTART, settings, pack, 12, -8, 10);
    expect(capped.current).toBe(12);
  });
});
