// Public surface of shared/src/installer: wire, fuse, energy-budget and commissioning calculations.
export type { InstallerInputErrorCode } from './installer-input-error';
export { InstallerInputError } from './installer-input-error';
export type { FindingSeverity, InstallerFinding, InstallerVerdict } from './installer-finding';
export type { SystemVoltage } from './system-voltage';
export { SYSTEM_VOLTAGES } from './system-voltage';
export type { AwgSize, ConductorSize } from './wire-gauge';
export {
  AWG_SIZES,
  IEC_60228_SIZES_MM2,
  COPPER_RESISTIVITY_20C,
  COPPER_TEMPERATURE_COEFFICIENT,
  CONDUCTOR_SIZES,
  awgDiameterMm,
  awgAreaMm2,
  copperResistancePerMetre,
  circuitVoltageDrop,
  conductorSize,
} from './wire-gauge';
export type { InsulationRatingC } from './conductor-ampacity';
export { INSULATION_RATINGS_C, AMPACITY_SOURCE, conductorAmpacity } from './conductor-ampacity';
export type { VoltageDrop } from './conductor-sizing';
export { voltageDropFor, minimumGaugeByDrop, minimumGaugeByAmpacity } from './conductor-sizing';
export type { ConductorConstruction } from './conductor-resistance';
export {
  CONDUCTOR_CONSTRUCTIONS,
  COPPER_TEMPERATURE_COEFFICIENT_75C,
  conductorResistancePerMetre,
  necStrandedResistancePerMetreAt75C,
  fineStrandFactor,
} from './conductor-resistance';
export type { DeratingFactor, InstallationConditions } from './conductor-derating';
export {
  DEFAULT_INSTALLATION,
  ENGINE_SPACE_AMBIENT_C,
  ambientCorrectionFactor,
  bundleFactor,
  deratingFactors,
  deratingMultiplier,
} from './conductor-derating';
export type { FuseRange, FuseRangeOptions, ProtectionRules } from './fuse-ratings';
export {
  COMMON_DC_FUSE_RATINGS_A,
  NEC_STANDARD_RATINGS_A,
  CONTINUOUS_LOAD_FACTOR,
  PROTECTION_RULES,
  fuseRange,
  maximumFuseRating,
} from './fuse-ratings';
export {
  FUSE_PLACEMENT_RULE,
  SHEATHED_FUSE_DISTANCE_M,
  UNSHEATHED_FUSE_DISTANCE_M,
  fusePlacementFinding,
} from './fuse-placement';
export type { FaultBank } from './fault-current';
export { prospectiveFaultCurrentA } from './fault-current';
export type { ResolvedWireFuseInput, WireFuseCheckInput } from './wire-fuse-input';
export { WIRE_FUSE_DEFAULTS } from './wire-fuse-input';
export type { ConductorFigures, WireFuseCheckResult } from './wire-fuse-check';
export { WIRE_AND_FUSE_CAUTIONS, checkWireAndFuse } from './wire-fuse-check';
export type { BudgetLoad, BudgetSource, BudgetSystem, EnergyBudgetInput } from './energy-budget-input';
export type { EnergyBudget } from './energy-budget';
export {
  DEFAULT_SOLAR_DERATE_PERCENT,
  energyBudget,
  inverterDcCurrent,
  peukertCapacityFraction,
} from './energy-budget';
export type { BudgetCircuit } from './budget-circuits';
export { budgetCircuits } from './budget-circuits';
export type { BudgetComparison, MeasuredEnergy } from './budget-comparison';
export { compareBudgetWithActual } from './budget-comparison';
export type { CommissioningOptions } from './commissioning-options';
export type {
  CommissioningPhase,
  CommissioningProgress,
  CommissioningState,
  CommissioningMeasurement,
} from './commissioning-tracker';
export { startCommissioning, feedCommissioning, commissioningProgress } from './commissioning-tracker';
export type { BulkPhase, CableDrop, CommissioningResult } from './commissioning-analysis';
export {
  CHARGE_CABLE_DROP_WARNING_PERCENT,
  UNSTEADY_CURRENT_PERCENT,
  analyzeCommissioning,
  commissioningResult,
} from './commissioning-analysis';
export type { RegisterSystem } from './install-register';
export {
  checkedAwgOf,
  componentCurrentA,
  judgeCircuit,
  registerBudgetInput,
  registeredSourceRatingA,
  ruleOfFinding,
} from './install-register';
export type { CircuitRatings, DesignComparison, MeasuredCurrent } from './design-vs-measured';
export {
  CLOSE_TO_RATING_FRACTION,
  PEAK_BAND_FRACTION,
  compareWithRatings,
  nearestRankPercentile,
  peakDurationSeconds,
} from './design-vs-measured';
