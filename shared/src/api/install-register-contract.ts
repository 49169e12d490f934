// Shapes of a system's install register (GET/POST/PUT/DELETE /api/systems/:id/install/...): what is fitted,
// how each circuit is wired and protected, and what the wire & fuse rules and the measured currents say of it.
import type { InstallerFinding } from '../installer/installer-finding';

/** What a component is. */
export type ComponentKind = 'battery' | 'charge-source' | 'inverter' | 'heater' | 'fridge' | 'load';

/** Every component kind, in the order the register lists them. */
export const COMPONENT_KINDS = [
  'battery',
  'charge-source',
  'inverter',
  'heater',
  'fridge',
  'load',
] as const satisfies readonly ComponentKind[];

/** The ratings of one component, by kind (from its datasheet or nameplate). */
export type ComponentRatings =
  | {
      kind: 'battery';
      chemistry: 'lifepo4' | 'agm' | 'flooded';
      capacityAh: number;
      /** BMS continuous discharge rating, A. */
      bmsContinuousA: number;
      /** BMS peak (short-time) discharge rating, A. */
      bmsPeakA?: number;
      /** How long the BMS allows its peak, s. */
      bmsPeakSeconds?: number;
    }
  | {
      kind: 'charge-source';
      sourceKind: 'dc-dc' | 'solar' | 'shore' | 'alternator' | 'other';
      /** Rated output current, A. */
      ratedCurrentA: number;
      /** The id the monitor reports this source's current under (`source:<id>`), when it does. */
      monitorSourceId?: string;
      /** Solar array peak power, W (solar only, for the energy budget). */
      panelWatts?: number;
      /** Hours a day it charges (chargers) or peak sun hours (solar), for the energy budget. */
      hoursPerDay: number;
    }
  | {
      kind: 'inverter';
      continuousW: number;
      surgeW: number;
      /** Its own draw while on with no load, W. */
      standbyW: number;
      /** Efficiency, 0.5–1. */
      efficiency: number;
    }
  | {
      kind: 'heater' | 'fridge' | 'load';
      /** DC draw, A (give this or watts). */
      amps?: number;
      /** Power, W (AC loads: nameplate watts through the inverter). */
      watts?: number;
      hoursPerDay: number;
      /** Share of the on-time it draws, 0–1. */
      dutyCycle: number;
      /** Runs from the inverter. */
      ac: boolean;
    };

/** One fitted component. */
export interface RegisterComponent {
  id: string;
  name: string;
  ratings: ComponentRatings;
}

/** What the monitor sees of a circuit's current: the pack current (main battery feed), a source's, or nothing. */
export type CircuitMonitoring = 'battery-feed' | 'source' | 'none';

/** One circuit as wired: conductor, run, surroundings and protection. */
export interface CircuitWiring {
  name: string;
  /** The component it feeds (for the main battery feed, the battery). */
  componentId: string;
  /** Conductor size: an AWG trade size or an IEC 60228 metric size. */
  conductor: { awg: string; mm2?: undefined } | { mm2: number; awg?: undefined };
  construction: 'stranded' | 'fine-stranded' | 'solid';
  oneWayLengthM: number;
  insulationRatingC: 60 | 75 | 90 | 105;
  location: 'general' | 'engine-space';
  /** Ambient around the run, °C. */
  ambientC: number;
  /** Current-carrying conductors bundled together, this one included. */
  bundledConductors: number;
  protection: { device: 'fuse' | 'breaker'; ratingA: number; type: string };
  /** Distance from the source (battery) to the fuse along the conductor, m. */
  fuseDistanceM: number | null;
  sheathed: boolean;
  /** Design continuous current, A; null takes it from the component's rating. */
  designCurrentA: number | null;
  /** Allowed voltage drop, % (3 for charging and critical loads, 10 otherwise — ABYC E-11). */
  allowedDropPercent: number;
  monitoring: CircuitMonitoring;
}

/** The verdict of the wire & fuse rules on one circuit, with the rule that decides it. */
export interface CircuitVerdict {
  ok: boolean;
  /** The deciding finding's sentence (the first error, else a summary). */
  summary: string;
  /** The rule cited for the deciding finding. */
  rule: string;
  /** AWG size the rules were applied to (a metric size is checked as the AWG no larger than it). */
  checkedAwg: string | null;
  /** Continuous current the circuit was checked for, A. */
  currentA: number;
  /** Derated ampacity, A. */
  ampacityA: number | null;
  /** Largest fuse the rules allow on it, A. */
  maximumFuseA: number | null;
  findings: (InstallerFinding & { rule: string })[];
}

/** A circuit with its stored wiring and its verdict. */
export interface RegisterCircuit extends CircuitWiring {
  id: string;
  verdict: CircuitVerdict;
}

/** GET /api/systems/:id/install. */
export interface InstallRegister {
  systemId: string;
  components: RegisterComponent[];
  circuits: RegisterCircuit[];
  /** Energy budget computed from the components; null without a battery. */
  budget: import('../installer/energy-budget').EnergyBudget | null;
}

/** How a measured current stands against one rating. */
export type RatingStanding = 'within' | 'close' | 'over';

/** One rating a measured current is compared with. */
export interface RatingComparison {
  rating: 'fuse' | 'conductor' | 'bms-continuous' | 'bms-peak';
  /** The rating, A. */
  limitA: number;
  /** The measured figure compared with it (peak or 99th percentile), A. */
  measuredA: number;
  measure: 'peak' | 'p99';
  standing: RatingStanding;
}

/** GET /api/systems/:id/install/measured: one monitored circuit's currents against its ratings. */
export interface CircuitDesignVsMeasured {
  circuitId: string;
  circuitName: string;
  /** Readings in the window that carried this circuit's current. */
  samples: number;
  windowFrom: number;
  windowTo: number;
  peakA: number | null;
  peakAt: number | null;
  /** How long the current stayed within 10 % of the peak around it, s. */
  peakSeconds: number | null;
  p99A: number | null;
  comparisons: RatingComparison[];
  /** The conductor's insulation rating, °C, and the protective device, to word the sentence in the viewer's unit. */
  insulationRatingC: number;
  protectionDevice: 'fuse' | 'breaker';
  standing: RatingStanding | 'no-data';
  /** Plain words: what peaked, for how long, against which ratings. */
  sentence: string;
}

/** GET /api/systems/:id/commissioning-record/choices: which checks the record can carry, and which by default. */
export interface RecordCheckChoice {
  checkId: string;
  sourceId: string;
  status: 'running' | 'passed' | 'failed' | 'abandoned';
  startedAt: number;
  ratedCurrentA: number;
  /** In the record unless the installer picks otherwise. */
  byDefault: boolean;
  /** Why it is left out by default: a later check of the same source, a rating no longer fitted, or no verdict. */
  leftOutBecause: 'superseded' | 'stale' | 'unfinished' | null;
}
