import type { RegisterCircuit, RegisterComponent } from '@cellwarden/shared';
import { ratingsInWords, recordCircuits, recordComponents } from './install-register-record';

const heater: RegisterComponent = {
  id: 'h',
  name: 'Diesel air heater',
  ratings: { kind: 'heater', amps: 1.5, hoursPerDay: 12, dutyCycle: 0.6, ac: false },
};

const circuit = (over: Partial<RegisterCircuit>): RegisterCircuit => ({
  id: 'c',
  name: 'Heater feed',
  componentId: 'h',
  conductor: { awg: '12' },
  construction: 'stranded',
  oneWayLengthM: 3,
  insulationRatingC: 105,
  location: 'engine-space',
  ambientC: 30,
  bundledConductors: 2,
  protection: { device: 'fuse', ratingA: 15, type: 'blade' },
  fuseDistanceM: 0.15,
  sheathed: true,
  designCurrentA: 10,
  allowedDropPercent: 3,
  monitoring: 'none',
  verdict: {
    ok: true,
    summary: '12 AWG carries 45 A derated',
    rule: '33 CFR 183.455(b)',
    checkedAwg: '12',
    currentA: 10,
    ampacityA: 45,
    maximumFuseA: 67.5,
    findings: [],
  },
  ...over,
});

describe('the install register in the record', () => {
  it('words each kind of component’s ratings', () => {
    expect(
      ratingsInWords({
        kind: 'battery',
        chemistry: 'lifepo4',
        capacityAh: 200,
        bmsContinuousA: 150,
        bmsPeakA: 300,
        bmsPeakSeconds: 10,
      }),
    ).toBe('200 Ah LiFePO4, BMS 150 A continuous, 300 A peak for 10 s');
    expect(recordComponents([heater])).toEqual([
      { name: 'Diesel air heater', kind: 'heater', ratings: '1.5 A DC, 12 h a day at 60 %' },
    ]);
  });

  it('gives each circuit its conductor, protection, fuse distance, verdict and rule', () => {
    expect(recordCircuits([circuit({})], [heater])).toEqual([
      {
        name: 'Heater feed',
        feeds: 'Diesel air heater',
        conductor: '12 AWG stranded, 105 °C, 3 m one way, engine space, 2 bundled',
        protection: '15 A blade fuse',
        fuseDistance: '150 mm, sheathed',
        verdict: 'PASS',
        summary: '12 AWG carries 45 A derated',
        rule: '33 CFR 183.455(b)',
      },
    ]);
    const [row] = recordCircuits(
      [
        circuit({
          conductor: { mm2: 4 },
          fuseDistanceM: null,
          verdict: { ...circuit({}).verdict, ok: false },
        }),
      ],
      [],
    );
    expect(row).toMatchObject({ feeds: '(removed)', fuseDistance: 'not given', verdict: 'FAIL' });
    expect(row.conductor).toMatch(/^4 mm² stranded/);
  });
});
