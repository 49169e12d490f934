import {
  AWG_SIZES,
  awgAreaMm2,
  awgDiameterMm,
  awgNumber,
  circuitVoltageDrop,
  conductorSize,
  CONDUCTOR_SIZES,
  copperResistancePerMetre,
} from './wire-gauge';

describe('wire gauge', () => {
  it('numbers the aught sizes below zero', () => {
    // ASTM B258 / Wikipedia "American wire gauge": 1/0 = 0, 2/0 = −1, 3/0 = −2, 4/0 = −3
    expect(AWG_SIZES.slice(-4).map(awgNumber)).toEqual([0, -1, -2, -3]);
  });

  it('gives diameters and cross-sections of the published AWG table', () => {
    // Wikipedia "American wire gauge" table (ASTM B258): 4 AWG 5.189 mm, 21.2 mm²
    expect(awgDiameterMm('4')).toBeCloseTo(5.189, 3);
    expect(awgAreaMm2('4')).toBeCloseTo(21.15, 2);
    // same table: 10 AWG 2.588 mm, 5.26 mm²
    expect(awgDiameterMm('10')).toBeCloseTo(2.588, 3);
    expect(awgAreaMm2('10')).toBeCloseTo(5.26, 2);
    // same table: 0000 (4/0) AWG 11.684 mm
    expect(awgDiameterMm('4/0')).toBeCloseTo(11.684, 3);
    // same table: 18 AWG 1.024 mm, 0.823 mm²
    expect(awgDiameterMm('18')).toBeCloseTo(1.024, 3);
    expect(awgAreaMm2('18')).toBeCloseTo(0.823, 3);
  });

  it('gives copper resistance per km of the published AWG table', () => {
    // Wikipedia "American wire gauge" table, copper at 20 °C: 10 AWG 3.277 Ω/km, 4 AWG 0.8152 Ω/km
    expect(copperResistancePerMetre('10') * 1000).toBeCloseTo(3.277, 3);
    expect(copperResistancePerMetre('4') * 1000).toBeCloseTo(0.8152, 4);
  });

  it('raises resistance with temperature by the copper coefficient', () => {
    // IEC 60028, α = 0.00393 /K: by hand, 3.277 Ω/km × (1 + 0.00393 × 40) = 3.792 Ω/km at 60 °C
    expect(copperResistancePerMetre('10', 60) * 1000).toBeCloseTo(3.792, 3);
  });

  it('counts the copper out and back for the voltage drop', () => {
    // Worked by hand: 4 AWG = 0.017241 Ω·mm²/m ÷ 21.15 mm² = 0.8152 mΩ/m; 2 m one way → 4 m of copper;
    // 60 A × 0.8152 mΩ/m × 4 m = 0.1956 V
    expect(circuitVoltageDrop('4', 60, 2)).toBeCloseTo(0.1956, 4);
  });

  it('puts the nearest and the next larger IEC 60228 size beside each AWG size', () => {
    // By hand from the IEC 60228 series: 21.15 mm² lies between 16 and 25; 25/21.15 = 1.18 < 21.15/16 = 1.32
    expect(conductorSize('4')).toMatchObject({ label: '4 AWG', nearestMetricMm2: 25, metricAtLeastMm2: 25 });
    // 0.823 mm²: 0.823/0.75 = 1.10 < 1/0.823 = 1.22, so 0.75 is nearest while 1 mm² is the safe substitute
    expect(conductorSize('18')).toMatchObject({ nearestMetricMm2: 0.75, metricAtLeastMm2: 1 });
    // 107.2 mm²: 120/107.2 = 1.119 < 107.2/95 = 1.128
    expect(conductorSize('4/0')).toMatchObject({ nearestMetricMm2: 120, metricAtLeastMm2: 120 });
  });

  it('lists every size thinnest first with growing cross-sections', () => {
    const areas = CONDUCTOR_SIZES.map((s) => s.areaMm2);
    expect(areas).toEqual([...areas].sort((a, b) => a - b));
    expect(CONDUCTOR_SIZES).toHaveLength(AWG_SIZES.length);
  });
});
