import { interruptingRatingFinding, prospectiveFaultCurrentA } from './fault-current';

describe('bank fault current', () => {
  it('puts thousands of amperes behind a LiFePO4 bank and fewer behind lead-acid', () => {
    // From memory (cell datasheets; common practice): 1.5 mΩ per 100 Ah LiFePO4 12 V block, 13.6 V full →
    // 9,067 A for 100 Ah; twice the cells in parallel halve the resistance
    expect(prospectiveFaultCurrentA({ chemistry: 'lifepo4', capacityAh: 100 }, 12)).toBeCloseTo(9067, 0);
    expect(prospectiveFaultCurrentA({ chemistry: 'lifepo4', capacityAh: 200 }, 12)).toBeCloseTo(18133, 0);
    // Series blocks add voltage and resistance alike: the same current at 24 V
    expect(prospectiveFaultCurrentA({ chemistry: 'lifepo4', capacityAh: 100 }, 24)).toBeCloseTo(9067, 0);
    // From memory: 100 Ah AGM ≈ 4 mΩ → 12.85 V / 4 mΩ ≈ 3,200 A (trade short-circuit figures 2,500–3,500 A)
    expect(prospectiveFaultCurrentA({ chemistry: 'agm', capacityAh: 100 }, 12)).toBeCloseTo(3212.5, 1);
  });

  it('fails a fuse whose interrupting rating is below the fault current and asks for it when unknown', () => {
    const bank = { chemistry: 'lifepo4' as const, capacityAh: 100 };
    expect(interruptingRatingFinding(9067, 2000, bank, 12)?.code).toBe('interrupting-rating-below-fault');
    expect(interruptingRatingFinding(9067, 20000, bank, 12)).toBeUndefined();
    expect(interruptingRatingFinding(9067, undefined, bank, 12)?.severity).toBe('warning');
    expect(interruptingRatingFinding(undefined, undefined, undefined, 12)).toBeUndefined();
  });
});
