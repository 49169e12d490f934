// Shapes of the installer tools: commissioning checks, energy budgets, uploads, the commissioning record.

/** POST /api/systems/:id/commissioning-checks body (installer of the system's company, or owner). */
export interface CommissioningCheckRequest {
  sourceId: string;
  ratedCurrentA: number;
  tolerancePercent?: number;
  /** How long to watch, seconds (60 to 1800). */
  windowSeconds: number;
  sourceOutputVoltage?: number;
  batteryTerminalVoltage?: number;
  gauge?: string;
  oneWayLengthM?: number;
}

/** A commissioning check as listed and polled (GET /api/systems/:id/commissioning-checks[/:checkId]). */
export interface CommissioningCheck {
  id: string;
  systemId: string;
  sourceId: string;
  ratedCurrentA: number;
  tolerancePercent: number;
  status: 'running' | 'passed' | 'failed' | 'abandoned';
  progress: { phase: string; secondsMeasured: number; secondsNeeded: number };
  startedAt: number;
  finishedAt: number | null;
  installer: { id: string; displayName: string };
  result: {
    meanCurrentA: number | null;
    minCurrentA: number | null;
    maxCurrentA: number | null;
    ripplePeakToPeakA: number | null;
    batteryVoltageReached: number | null;
    cableDropV: number | null;
    reasons: string[];
    /** Measured times of the bulk phase's first and last readings, ms (checks since the record's chart). */
    measuredFrom?: number;
    measuredTo?: number;
  } | null;
}

/** An uploaded file (log or photo) of a system: POST /api/systems/:id/uploads (multipart field `file`). */
export interface UploadListing {
  id: string;
  kind: 'photo' | 'log';
  fileName: string;
  contentType: string;
  bytes: number;
  uploadedAt: number;
  caption: string;
}
// GET /api/systems/:id/commissioning-record.pdf downloads the record; POST .../commissioning-record/email sends it to the owner.

/** A saved energy budget of a system (GET/POST /api/systems/:id/energy-budgets, PUT/DELETE .../:budgetId). */
export interface SavedEnergyBudget {
  id: string;
  name: string;
  budget: import('../installer/energy-budget-input').EnergyBudgetInput;
  createdAt: number;
  updatedAt: number;
}

/** GET /api/systems/:id/energy-budgets/:budgetId/comparison?days=7: the budget against what the system did. */
export interface EnergyBudgetComparison {
  budget: import('../installer/energy-budget').EnergyBudget;
  days: number;
  measured: { whIn: number; whOut: number; perDay: { day: string; whIn: number; whOut: number }[] };
  comparison: import('../installer/budget-comparison').BudgetComparison;
}
