/** How full the pack is, in words as well as colour. */
export type ChargeBand = 'critical' | 'low' | 'fair' | 'good';

/** Height of the column's inside, in SVG units. */
export const COLUMN_HEIGHT = 200;

/** The band a state of charge falls in (boundaries: ≤ 15 %, ≤ 30 %, ≤ 60 %; common practice for reserve levels). */
export function chargeBand(stateOfCharge: number): ChargeBand {
  if (stateOfCharge <= 15) return 'critical';
  if (stateOfCharge <= 30) return 'low';
  if (stateOfCharge <= 60) return 'fair';
  return 'good';
}

/** The y coordinate (0 at the top) of a state of charge in the column, clamped to 0–100 %. */
export function levelY(stateOfCharge: number): number {
  const clamped = Math.min(100, Math.max(0, stateOfCharge));
  return COLUMN_HEIGHT * (1 - clamped / 100);
}
