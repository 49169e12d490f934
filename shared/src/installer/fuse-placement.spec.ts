import { fusePlacementFinding, SHEATHED_FUSE_DISTANCE_M, UNSHEATHED_FUSE_DISTANCE_M } from './fuse-placement';

describe('fuse placement', () => {
  it('converts the published distances to metres', () => {
    // 33 CFR 183.455(b)(1) and (2): 7 in and 40 in, 1 in = 25.4 mm exactly
    expect(UNSHEATHED_FUSE_DISTANCE_M).toBeCloseTo(0.1778, 9);
    expect(SHEATHED_FUSE_DISTANCE_M).toBeCloseTo(1.016, 9);
  });

  it('accepts the fuse at the source, within 7 in, and within 40 in only when sheathed', () => {
    // 33 CFR 183.455(b): at the source of power; (b)(1) within seven inches; (b)(2) within 40 inches in a sheath
    expect(fusePlacementFinding(0, false).severity).toBe('info');
    expect(fusePlacementFinding(0.1778, false).severity).toBe('info');
    expect(fusePlacementFinding(0.18, false)).toMatchObject({ severity: 'error', code: 'fuse-too-far' });
    expect(fusePlacementFinding(1.016, true).severity).toBe('info');
    expect(fusePlacementFinding(1.02, true)).toMatchObject({ severity: 'error', code: 'fuse-too-far' });
  });

  it('asks for the distance when none is given', () => {
    expect(fusePlacementFinding(undefined, false)).toMatchObject({
      severity: 'warning',
      code: 'fuse-distance-not-given',
    });
  });
});
