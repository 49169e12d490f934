// How Cellwarden estimates a battery's capacity, and what its health report does and does not claim, in our
// own words. The screen, the PDF and the CSV all state the same text.

/** The method statement with its published basis. */
export const HEALTH_METHOD =
  'Usable capacity is measured from the data by coulomb counting between two points of known state of charge: ' +
  'a full-charge synchronisation (the charged voltage held while the charge current has tapered to the tail ' +
  'current) and a later point read from the rested open-circuit voltage on the chemistry’s curve, or a BMS ' +
  'low-voltage cut-off. The amp-hours counted between them, divided by the share of the scale they span, give ' +
  'one estimate with its own uncertainty; estimates are combined month by month as an inverse-variance ' +
  'weighted mean. State of health is the estimate divided by the rated usable capacity. Basis: coulomb ' +
  'counting with open-circuit-voltage recalibration (Piller, Perrin and Jossen, J. Power Sources 96 (2001) ' +
  '113–120; Plett, Battery Management Systems vol. I, 2015). Life-cycle figures (equivalent full cycles, ' +
  'depth of discharge by rainflow counting, energy, temperature exposure) are accumulated hour by hour from ' +
  'the stored hourly summaries.';

/** The disclaimer every health report carries. */
export const HEALTH_DISCLAIMERS: readonly string[] = [
  'These figures are estimates made from the monitor’s measurements. They are not a warranty assessment and not a test of the battery by its maker.',
  'For warranty questions and for the battery’s limits, the manufacturer’s documents and tests decide.',
  'Never charge a LiFePO4 battery below 0 °C unless its manufacturer allows it and its BMS enforces the limit.',
  'Cellwarden monitors the system. It never replaces the battery management system (BMS) or its protections.',
];

/** What the screen says when hours gained readings after the job had counted them. */
export function lateDataNote(lateRebuilds: number): string | null {
  if (lateRebuilds === 0) return null;
  return (
    'Some readings arrived after the hours they belong to had been counted. The life-cycle figures were ' +
    'counted again from the hourly summaries; capacity estimates already made were kept, and late minutes ' +
    'before the last estimate were not used for a new one.'
  );
}
