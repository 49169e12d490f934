/** Battery chemistries the models know. */
export type Chemistry = 'lifepo4' | 'agm' | 'flooded';

/** Electrical and thermal constants of one chemistry, per 12 V nominal block. */
export interface ChemistryProfile {
  /** Open-circuit voltage table for a 12 V block: [stateOfCharge %, volts], ascending. */
  openCircuitVoltageTable: readonly (readonly [number, number])[];
  /** Below this pack temperature charging damages the cells, °C. */
  minimumChargeTemperature: number;
  /** Fraction of charge current stored (coulombic efficiency). */
  chargeEfficiency: number;
  /** Peukert exponent; 1 means capacity does not depend on discharge rate. */
  peukertExponent: number;
  /** Internal resistance of a 100 Ah 12 V block, ohms. */
  internalResistance100Ah: number;
  /** Usable capacity fraction vs temperature: [°C, fraction], ascending. */
  capacityFactorTable: readonly (readonly [number, number])[];
  /** Charge voltages of a 12 V block at 25 °C, volts. */
  bulkVoltage: number;
  absorptionVoltage: number;
  floatVoltage: number;
  lowVoltageCutoff: number;
  /** Nominal voltage of one "12 V" block of this chemistry (4 × 3.2 V LiFePO4, 6 × 2.0 V lead-acid), volts. */
  nominalBlockVoltage: number;
  /** Cells in series in one 12 V block. */
  cellsPerBlock: number;
  /** Change of the charge voltages per cell per °C away from 25 °C, volts (0: not compensated). */
  chargeVoltageCoefficientPerCell: number;
  /** Above this pack temperature charging should stop, °C; undefined when the chemistry sets none. */
  maximumChargeTemperature?: number;
  /** Below `belowTemperature` (and above the minimum) charge current should stay under `maximumCRate` × capacity. */
  reducedChargeCurrent?: { belowTemperature: number; maximumCRate: number };
}

/** Temperature the charge voltages of a profile refer to, °C (lead-acid datasheets, from memory). */
export const CHARGE_VOLTAGE_REFERENCE_C = 25;

// Values are typical of trade datasheets and quoted from memory unless a spec checks them against a source.
export const CHEMISTRY_PROFILES: Readonly<Record<Chemistry, ChemistryProfile>> = {
  lifepo4: {
    openCircuitVoltageTable: [
      // LiFePO4/graphite rests above 3.2 V/cell down to about 10 % and falls steeply only in the last few
      // percent (published OCV-SoC curves of LFP cells, from memory): a straight line from the 2.5 V cut-off
      // to 10 % would read a rested, nearly empty pack several points too full.
      [0, 10.0],
      [2, 12.0],
      [5, 12.5],
      [10, 12.8],
      [20, 13.0],
      [30, 13.05],
      [40, 13.1],
      [50, 13.15],
      [60, 13.2],
      [70, 13.25],
      [80, 13.3],
      [90, 13.33],
      [100, 13.6],
    ],
    minimumChargeTemperature: 0,
    chargeEfficiency: 0.99,
    peukertExponent: 1.03,
    internalResistance100Ah: 0.008,
    capacityFactorTable: [
      [-20, 0.7],
      [0, 0.88],
      [25, 1],
      [45, 1],
    ],
    bulkVoltage: 14.2,
    absorptionVoltage: 14.2,
    floatVoltage: 13.5,
    lowVoltageCutoff: 10.0,
    nominalBlockVoltage: 12.8,
    cellsPerBlock: 4,
    // LiFePO4 chargers do not compensate for temperature (cell datasheets, common practice).
    chargeVoltageCoefficientPerCell: 0,
    // Many cell makers stop charging at about 45 °C and cut the current between 0 and about 10 °C
    // (cell datasheets, from memory; 0.1 C is the conservative end of their range).
    maximumChargeTemperature: 45,
    reducedChargeCurrent: { belowTemperature: 10, maximumCRate: 0.1 },
  },
  agm: {
    openCircuitVoltageTable: [
      [0, 11.51],
      [10, 11.66],
      [20, 11.81],
      [30, 11.96],
      [40, 12.1],
      [50, 12.24],
      [60, 12.37],
      [70, 12.5],
      [80, 12.62],
      [90, 12.73],
      [100, 12.85],
    ],
    minimumChargeTemperature: -20,
    chargeEfficiency: 0.9,
    peukertExponent: 1.15,
    internalResistance100Ah: 0.005,
    capacityFactorTable: [
      [-20, 0.6],
      [0, 0.8],
      [25, 1],
      [45, 1.05],
    ],
    bulkVoltage: 14.4,
    absorptionVoltage: 14.4,
    floatVoltage: 13.6,
    lowVoltageCutoff: 10.5,
    nominalBlockVoltage: 12,
    cellsPerBlock: 6,
    // −4 mV per cell per °C from 25 °C (AGM datasheets, from memory): −24 mV/°C on a 12 V block.
    chargeVoltageCoefficientPerCell: -0.004,
  },
  flooded: {
    openCircuitVoltageTable: [
      [0, 11.31],
      [10, 11.51],
      [20, 11.66],
      [30, 11.81],
      [40, 11.96],
      [50, 12.1],
      [60, 12.24],
      [70, 12.37],
      [80, 12.5],
      [90, 12.62],
      [100, 12.73],
    ],
    minimumChargeTemperature: -20,
    chargeEfficiency: 0.85,
    peukertExponent: 1.25,
    internalResistance100Ah: 0.006,
    capacityFactorTable: [
      [-20, 0.55],
      [0, 0.78],
      [25, 1],
      [45, 1.05],
    ],
    bulkVoltage: 14.6,
    absorptionVoltage: 14.6,
    floatVoltage: 13.5,
    lowVoltageCutoff: 10.5,
    nominalBlockVoltage: 12,
    cellsPerBlock: 6,
    // −5 mV per cell per °C from 25 °C (flooded deep-cycle datasheets, from memory).
    chargeVoltageCoefficientPerCell: -0.005,
  },
};
