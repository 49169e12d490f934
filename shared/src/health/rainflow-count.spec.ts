import { CountedRange, pushRainflowPoint, residueRanges } from './rainflow-count';

function countAll(history: readonly number[]): CountedRange[] {
  const points: number[] = [];
  const counted = history.flatMap((value) => pushRainflowPoint(points, value));
  return [...counted, ...residueRanges(points)];
}

function cyclesByRange(counted: readonly CountedRange[]): Record<number, number> {
  const byRange: Record<number, number> = {};
  for (const { range, cycles } of counted) byRange[range] = (byRange[range] ?? 0) + cycles;
  return byRange;
}

describe('rainflow counting', () => {
  it('counts the standard worked example as the standard does', () => {
    // ASTM E1049-85, §5.4.4 rainflow counting, worked example A…I = −2, 1, −3, 5, −1, 3, −4, 4, −2 and its table of
    // counts: range 3 → 0.5, 4 → 1.5, 6 → 0.5, 8 → 1.0, 9 → 0.5 (from memory).
    const counted = countAll([-2, 1, -3, 5, -1, 3, -4, 4, -2]);
    expect(cyclesByRange(counted)).toEqual({ 3: 0.5, 4: 1.5, 6: 0.5, 8: 1, 9: 0.5 });
  });

  it('only counts reversals: points that keep going the same way extend the last one', () => {
    const counted = countAll([0, 2, 5, 9, 4, 1, 0, 3]);
    // Reversals 0, 9, 0, 3: ranges 9 (half), 9 (half) from the start, 3 (half) still open.
    expect(cyclesByRange(counted)).toEqual({ 9: 1, 3: 0.5 });
  });

  it('closes the cycles nested inside a large swing and leaves the swing itself as half cycles', () => {
    // Worked by hand: 40→30 closes when 30→60 exceeds it, 20→60 when 60→10 exceeds it; 100→10 remains.
    const counted = countAll([100, 20, 40, 30, 60, 10]);
    expect(counted).toEqual([
      { range: 10, cycles: 1 },
      { range: 40, cycles: 1 },
      { range: 90, cycles: 0.5 },
    ]);
  });

  it('gives the same counts fed in pieces, with the stack kept as JSON between them', () => {
    const history = [50, 80, 30, 90, 20, 60, 40, 100, 0, 70, 65, 75];
    let points: number[] = [];
    const counted: CountedRange[] = [];
    for (const value of history) {
      counted.push(...pushRainflowPoint(points, value));
      points = JSON.parse(JSON.stringify(points)) as number[];
    }
    counted.push(...residueRanges(points));
    expect(cyclesByRange(counted)).toEqual(cyclesByRange(countAll(history)));
  });

  it('ignores a repeated value', () => {
    const points: number[] = [];
    pushRainflowPoint(points, 40);
    expect(pushRainflowPoint(points, 40)).toEqual([]);
    expect(points).toEqual([40]);
  });
});
