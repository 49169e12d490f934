/** Nominal DC system voltages the installer tools accept, V. */
export const SYSTEM_VOLTAGES = [12, 24, 48] as const;

/** One nominal DC system voltage, V. */
export type SystemVoltage = (typeof SYSTEM_VOLTAGES)[number];
