import fc from 'fast-check';
import { INSULATION_RATINGS_C } from './conductor-ampacity';
import { CONDUCTOR_CONSTRUCTIONS } from './conductor-resistance';
import { PROTECTION_RULES } from './fuse-ratings';
import { SYSTEM_VOLTAGES } from './system-voltage';
import { checkWireAndFuse, WireFuseCheckInput } from './wire-fuse-check';

// Findings that depend on where the fuse is and what it interrupts, not on the conductor or its rating.
const PLACEMENT_AND_INTERRUPTING = ['fuse-too-far', 'interrupting-rating-below-fault'];

const inputs: fc.Arbitrary<WireFuseCheckInput> = fc.record({
  currentA: fc.double({ min: 0.1, max: 450, noNaN: true }),
  oneWayLengthM: fc.double({ min: 0.1, max: 30, noNaN: true }),
  systemVoltage: fc.constantFrom(...SYSTEM_VOLTAGES),
  allowedDropPercent: fc.constantFrom(3, 10),
  insulationRatingC: fc.constantFrom(...INSULATION_RATINGS_C),
  conductorTemperatureC: fc.integer({ min: -20, max: 105 }),
  construction: fc.constantFrom(...CONDUCTOR_CONSTRUCTIONS),
  rules: fc.constantFrom(...PROTECTION_RULES),
  ambientC: fc.integer({ min: -20, max: 70 }),
  engineSpace: fc.boolean(),
  bundledConductors: fc.integer({ min: 1, max: 30 }),
  sheathed: fc.boolean(),
  fuseDistanceM: fc.option(fc.double({ min: 0, max: 3, noNaN: true }), { nil: undefined }),
});

describe('wire and fuse check never contradicts its own recommendation', () => {
  it('names a common fuse rating that protects every conductor it recommends, with the rule', () => {
    fc.assert(
      fc.property(inputs, (input) => {
        const result = checkWireAndFuse(input);
        const errors = result.verdict.findings.filter((f) => f.severity === 'error').map((f) => f.code);
        if (result.governingGauge === undefined) {
          // No recommendation is always explained by an error.
          expect(errors.length).toBeGreaterThan(0);
          return;
        }
        const fuse = result.recommendation!.fuse;
        expect(fuse.standardRatingsA.length).toBeGreaterThan(0);
        expect(fuse.recommendedA).toBeGreaterThanOrEqual(fuse.minimumA);
        expect(fuse.recommendedA).toBeLessThanOrEqual(fuse.maximumA);
        expect(fuse.recommendedRule).toMatch(/NEC 240\.4|33 CFR 183\.455/);
        // Without a proposal the verdict is on the recommendation: only placement can fail it.
        expect(errors.filter((code) => !PLACEMENT_AND_INTERRUPTING.includes(code))).toEqual([]);
        // Proposing exactly what it recommended passes everything but placement.
        const again = checkWireAndFuse({
          ...input,
          proposedGauge: result.governingGauge,
          proposedFuseA: fuse.recommendedA,
        });
        const againErrors = again.verdict.findings.filter((f) => f.severity === 'error').map((f) => f.code);
        expect(againErrors.filter((code) => !PLACEMENT_AND_INTERRUPTING.includes(code))).toEqual([]);
      }),
      { numRuns: 500 },
    );
  });
});
