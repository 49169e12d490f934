/** How much a finding matters: `error` fails the check, `warning` deserves a look, `info` is a note. */
export type FindingSeverity = 'error' | 'warning' | 'info';

/** One observation of an installer check, with a stable code and a sentence for the installer. */
export interface InstallerFinding {
  /** How much it matters. */
  severity: FindingSeverity;
  /** Stable, machine-readable code (e.g. `fuse-above-ampacity`). */
  code: string;
  /** A sentence quoting the numbers involved. */
  message: string;
}

/** The outcome of a check: `ok` unless a finding is an error. */
export interface InstallerVerdict {
  /** False when any finding has severity `error`. */
  ok: boolean;
  /** Everything the check noticed, errors first. */
  findings: InstallerFinding[];
}

const SEVERITY_ORDER: Record<FindingSeverity, number> = { error: 0, warning: 1, info: 2 };

/** A verdict from findings: sorted errors first, `ok` when none is an error. */
export function verdictOf(findings: readonly InstallerFinding[]): InstallerVerdict {
  const sorted = [...findings].sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
  return { ok: !sorted.some((f) => f.severity === 'error'), findings: sorted };
}

/** A number rounded for a message: one decimal below 100, whole above (52.1 A, 185 A). */
export function formatAmount(value: number): string {
  const rounded = Math.abs(value) >= 100 ? Math.round(value) : Math.round(value * 10) / 10;
  return String(rounded);
}
