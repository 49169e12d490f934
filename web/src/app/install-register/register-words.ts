// How the register's rows read on screen: a component's ratings, a conductor and a fuse's distance in words.
import type { ComponentRatings, RegisterCircuit } from '@cellwarden/shared';

const SOURCE_WORDS = {
  'dc-dc': 'DC-DC charger',
  solar: 'solar controller',
  shore: 'shore-power charger',
  alternator: 'alternator',
  other: 'charge source',
} as const;

/** A component's kind and ratings in a short line, numbers in the viewer's locale. */
export function componentSummary(ratings: ComponentRatings, locale?: string): string {
  const n = (value: number) => value.toLocaleString(locale, { maximumFractionDigits: 1 });
  switch (ratings.kind) {
    case 'battery':
      return `Battery ${n(ratings.capacityAh)} Ah, BMS ${n(ratings.bmsContinuousA)} A continuous${ratings.bmsPeakA ? `, ${n(ratings.bmsPeakA)} A peak` : ''}`;
    case 'charge-source':
      return `${SOURCE_WORDS[ratings.sourceKind]}, rated ${n(ratings.ratedCurrentA)} A${ratings.monitorSourceId ? ` (monitor: ${ratings.monitorSourceId})` : ''}`;
    case 'inverter':
      return `Inverter ${n(ratings.continuousW)} W continuous, ${n(ratings.surgeW)} W surge, ${n(ratings.standbyW)} W standby`;
    default: {
      const draw = ratings.amps !== undefined ? `${n(ratings.amps)} A` : `${n(ratings.watts ?? 0)} W`;
      return `${ratings.kind === 'load' ? 'Load' : ratings.kind === 'heater' ? 'Heater' : 'Fridge'} ${draw}${ratings.ac ? ' AC' : ''}, ${n(ratings.hoursPerDay)} h a day`;
    }
  }
}

/** `4 AWG stranded` or `25 mm² fine-stranded`. */
export function conductorLabel(circuit: RegisterCircuit, locale?: string): string {
  const size =
    circuit.conductor.awg !== undefined
      ? `${circuit.conductor.awg} AWG`
      : `${circuit.conductor.mm2.toLocaleString(locale)} mm²`;
  return `${size} ${circuit.construction}`;
}

/** The fuse's distance from the battery in mm below a metre, else m; and whether it is sheathed. */
export function fuseDistanceLabel(circuit: RegisterCircuit, locale?: string): string {
  const d = circuit.fuseDistanceM;
  if (d === null) return 'not given';
  const text =
    d < 1
      ? `${Math.round(d * 1000).toLocaleString(locale)} mm`
      : `${d.toLocaleString(locale, { maximumFractionDigits: 2 })} m`;
  return circuit.sheathed ? `${text}, sheathed` : text;
}
