// The register as the commissioning record prints it: each component's ratings and each circuit's row in words.
import type { ComponentRatings, RegisterCircuit, RegisterComponent } from '@cellwarden/shared';
import type { RecordCircuit, RecordComponent } from '../records/commissioning-record-input';

const KIND_WORDS: Record<ComponentRatings['kind'], string> = {
  battery: 'battery and BMS',
  'charge-source': 'charge source',
  inverter: 'inverter',
  heater: 'heater',
  fridge: 'fridge',
  load: 'load',
};
const CHEMISTRY = { lifepo4: 'LiFePO4', agm: 'AGM', flooded: 'flooded lead-acid' } as const;

/** A component's ratings in words. */
export function ratingsInWords(ratings: ComponentRatings): string {
  switch (ratings.kind) {
    case 'battery':
      return (
        `${ratings.capacityAh} Ah ${CHEMISTRY[ratings.chemistry]}, BMS ${ratings.bmsContinuousA} A continuous` +
        (ratings.bmsPeakA
          ? `, ${ratings.bmsPeakA} A peak${ratings.bmsPeakSeconds ? ` for ${ratings.bmsPeakSeconds} s` : ''}`
          : '')
      );
    case 'charge-source':
      return `${ratings.sourceKind}, rated ${ratings.ratedCurrentA} A${ratings.monitorSourceId ? `, reported by the monitor as "${ratings.monitorSourceId}"` : ''}`;
    case 'inverter':
      return `${ratings.continuousW} W continuous, ${ratings.surgeW} W surge, ${ratings.standbyW} W standby`;
    default: {
      const draw = ratings.amps !== undefined ? `${ratings.amps} A` : `${ratings.watts ?? 0} W`;
      return `${draw}${ratings.ac ? ' AC' : ' DC'}, ${ratings.hoursPerDay} h a day at ${Math.round(ratings.dutyCycle * 100)} %`;
    }
  }
}

/** The components as the record lists them. */
export function recordComponents(components: readonly RegisterComponent[]): RecordComponent[] {
  return components.map((c) => ({
    name: c.name,
    kind: KIND_WORDS[c.ratings.kind],
    ratings: ratingsInWords(c.ratings),
  }));
}

/** The circuits as the record's table shows them. */
export function recordCircuits(
  circuits: readonly RegisterCircuit[],
  components: readonly RegisterComponent[],
): RecordCircuit[] {
  return circuits.map((c) => {
    const size = c.conductor.awg !== undefined ? `${c.conductor.awg} AWG` : `${c.conductor.mm2} mm²`;
    const where = c.location === 'engine-space' ? ', engine space' : '';
    return {
      name: c.name,
      feeds: components.find((k) => k.id === c.componentId)?.name ?? '(removed)',
      conductor: `${size} ${c.construction}, ${c.insulationRatingC} °C, ${c.oneWayLengthM} m one way${where}, ${c.bundledConductors} bundled`,
      protection: `${c.protection.ratingA} A ${c.protection.type} ${c.protection.device}`.replace(
        /\s+/g,
        ' ',
      ),
      fuseDistance:
        c.fuseDistanceM === null
          ? 'not given'
          : `${c.fuseDistanceM < 1 ? `${Math.round(c.fuseDistanceM * 1000)} mm` : `${c.fuseDistanceM} m`}${c.sheathed ? ', sheathed' : ''}`,
      verdict: c.verdict.ok ? 'PASS' : 'FAIL',
      summary: c.verdict.summary,
      rule: c.verdict.rule,
    };
  });
}
