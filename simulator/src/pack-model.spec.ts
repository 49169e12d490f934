import { mulberry32 } from './mulberry32';
import { PackState, stepPack, terminalVoltage } from './pack-model';

const pack: PackState = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  stateOfCharge: 60,
  temperature: 20,
  current: 0,
};

describe('pack model', () => {
  it('sags under load and rises under charge', () => {
    const rest = terminalVoltage(pack);
    expect(terminalVoltage({ ...pack, current: -50 })).toBeLessThan(rest);
    expect(terminalVoltage({ ...pack, current: 30 })).toBeGreaterThan(rest);
  });

  it('loses charge when discharging and gains it when charging', () => {
    expect(stepPack(pack, 3600, -10).stateOfCharge).toBeLessThan(60);
    expect(stepPack(pack, 3600, 10).stateOfCharge).toBeGreaterThan(60);
  });

  it('repeats the same random sequence for the same seed', () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    expect([a(), a(), a()]).toEqual([b(), b(), b()]);
  });
});
