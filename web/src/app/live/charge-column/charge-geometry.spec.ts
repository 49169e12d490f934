import { COLUMN_HEIGHT, chargeBand, levelY } from './charge-geometry';

describe('charge column geometry', () => {
  it('puts a full pack at the top and an empty one at the bottom', () => {
    expect(levelY(100)).toBe(0);
    expect(levelY(0)).toBe(COLUMN_HEIGHT);
    expect(levelY(25)).toBe(COLUMN_HEIGHT * 0.75);
  });

  it('clamps values a monitor reports outside 0–100 %', () => {
    expect(levelY(104)).toBe(0);
    expect(levelY(-3)).toBe(COLUMN_HEIGHT);
  });

  it('names the band at each boundary', () => {
    expect([10, 15, 16, 30, 31, 60, 61].map(chargeBand)).toEqual([
      'critical',
      'critical',
      'low',
      'low',
      'fair',
      'fair',
      'good',
    ]);
  });
});
