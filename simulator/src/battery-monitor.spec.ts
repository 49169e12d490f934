import { countCharge, drawSensorBias, MonitorState, takeReading } from './battery-monitor';
import { mulberry32 } from './mulberry32';

const truth = {
  measuredAt: Date.UTC(2026, 0, 1),
  voltage: 13.2,
  current: -4,
  temperature: 5,
  sourceCurrents: { solar: 0, shore: 6 },
};

describe('battery monitor', () => {
  it('draws the same small bias for the same seed', () => {
    expect(drawSensorBias(mulberry32(5), 12)).toEqual(drawSensorBias(mulberry32(5), 12));
    expect(drawSensorBias(mulberry32(5), 12)).not.toEqual(drawSensorBias(mulberry32(6), 12));
    const bias = drawSensorBias(mulberry32(5), 12);
    expect(Math.abs(bias.current)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(bias.temperature)).toBeLessThanOrEqual(0.3);
  });

  it('coulomb-counts what it measures, so its bias becomes drift', () => {
    const monitor: MonitorState = {
      bias: { voltage: 0, current: 0.05, temperature: 0 },
      stateOfCharge: 50,
      capacityAh: 100,
    };
    let counted = monitor;
    for (let t = 0; t < 10 * 3600; t += 10) counted = countCharge(counted, -2, 10);
    // Coulomb counting: ΔSoC = ∫I dt / C; 10 h of (−2 + 0.05) A on 100 Ah is −19.5 points, not −20.
    expect(counted.stateOfCharge).toBeCloseTo(50 - 19.5, 6);
  });

  it('reports values near the truth with its resolution and zero for an idle source', () => {
    const monitor: MonitorState = {
      bias: drawSensorBias(mulberry32(1), 12),
      stateOfCharge: 62.345,
      capacityAh: 100,
    };
    const reading = takeReading(truth, monitor, mulberry32(2));
    expect(Math.abs(reading.current - truth.current)).toBeLessThan(0.1);
    expect(Math.abs(reading.voltage - truth.voltage)).toBeLessThan(0.01);
    expect(reading.stateOfCharge).toBe(62.3);
    expect(reading.sourceCurrents).toMatchObject({ solar: 0 });
    expect(reading.power).toBeCloseTo(reading.voltage * reading.current, 1);
  });
});
