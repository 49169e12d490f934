import type { FlagKind, FlagSeverity, SystemStatus, SystemSummary } from '@cellwarden/shared';
import { flagText } from '../core/flag-text';
import { isStale } from '../core/staleness';

/** One line of the fleet table. */
export interface FleetRow {
  id: string;
  name: string;
  /** E.g. "12 V LiFePO4 · 180 Ah usable · van". */
  description: string;
  lastSeenAt: number | null;
  stateOfCharge: number | null;
  voltage: number | null;
  flags: { kind: FlagKind; severity: FlagSeverity; title: string }[];
  /** The worst active flag's severity, or null. */
  worst: FlagSeverity | null;
  /** No reading within the stale limit. */
  silent: boolean;
  /** Sort rank: 3 critical, 2 warning, 1 silent, 0 fine. */
  attention: number;
}

const CHEMISTRY_NAMES = { lifepo4: 'LiFePO4', agm: 'AGM', flooded: 'flooded lead-acid' } as const;

/** A fleet row from a system and its status (null while or when the status could not be read). */
export function toFleetRow(system: SystemSummary, status: SystemStatus | null, now: number): FleetRow {
  const reading = status?.latestReading ?? system.latestReading;
  const flags = (status?.derived?.activeFlags ?? []).map((f) => ({
    kind: f.kind,
    severity: f.severity,
    title: flagText(f.kind).title,
  }));
  const worst = flags.some((f) => f.severity === 'critical') ? 'critical' : flags.length ? 'warning' : null;
  const silent = isStale(reading?.measuredAt, now);
  return {
    id: system.id,
    name: system.name,
    description: `${system.nominalVoltage} V ${CHEMISTRY_NAMES[system.chemistry] ?? system.chemistry} · ${system.usableCapacityAh} Ah usable · ${system.kind}`,
    lastSeenAt: reading?.measuredAt ?? null,
    stateOfCharge: status?.derived?.stateOfCharge ?? reading?.stateOfCharge ?? null,
    voltage: reading?.voltage ?? null,
    flags,
    worst,
    silent,
    attention: worst === 'critical' ? 3 : worst === 'warning' ? 2 : silent ? 1 : 0,
  };
}

/** Whether a row matches a search term (name, description, flag titles; case-insensitive). */
export function matchesSearch(row: FleetRow, term: string): boolean {
  const needle = term.trim().toLowerCase();
  if (!needle) return true;
  const haystack = [row.name, row.description, ...row.flags.map((f) => f.title), row.silent ? 'silent' : '']
    .join(' ')
    .toLowerCase();
  return haystack.includes(needle);
}

/** The value a column sorts by; missing values sort as lowest. */
export function fleetSortValue(row: FleetRow, column: string): string | number {
  switch (column) {
    case 'name':
      return row.name.toLowerCase();
    case 'lastSeen':
      return row.lastSeenAt ?? -Infinity;
    case 'stateOfCharge':
      return row.stateOfCharge ?? -Infinity;
    case 'voltage':
      return row.voltage ?? -Infinity;
    case 'flags':
      return row.attention * 100 + row.flags.length;
    default:
      return '';
  }
}
