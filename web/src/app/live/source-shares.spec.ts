import { sourceShares } from './source-shares';

describe('sourceShares', () => {
  it('splits the charge current among the sources, largest first', () => {
    // Arithmetic: 30 A of 40 A is 0.75, 10 A of 40 A is 0.25.
    const shares = sourceShares({ solar: 10, dcdc: 30 }, { dcdc: 'DC-DC charger' });
    expect(shares.map((s) => [s.label, s.share])).toEqual([
      ['DC-DC charger', 0.75],
      ['solar', 0.25],
    ]);
  });

  it('gives a source drawing current no share of the charge', () => {
    const shares = sourceShares({ shore: 12, solar: -0.2 });
    expect(shares.find((s) => s.id === 'solar')?.share).toBe(0);
    expect(shares.find((s) => s.id === 'shore')?.share).toBe(1);
  });

  it('reports no shares when no source delivers current', () => {
    expect(sourceShares({ solar: 0 }).map((s) => s.share)).toEqual([0]);
    expect(sourceShares(undefined)).toEqual([]);
  });
});
