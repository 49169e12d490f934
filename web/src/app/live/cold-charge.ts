import type { BatteryReading } from '@cellwarden/shared';

/** Charge current above which a cold LiFePO4 pack counts as being charged, amperes. */
export const COLD_CHARGE_CURRENT_A = 0.5;
/** Temperature below which LiFePO4 must not be charged, °C. */
export const COLD_CHARGE_TEMPERATURE_C = 0;

/** Whether a LiFePO4 pack is being charged below freezing. */
export function isColdCharging(
  chemistry: string,
  reading: Pick<BatteryReading, 'current' | 'temperature'>,
): boolean {
  return (
    chemistry === 'lifepo4' &&
    reading.current > COLD_CHARGE_CURRENT_A &&
    reading.temperature < COLD_CHARGE_TEMPERATURE_C
  );
}
