import {
  compareWithRatings,
  peakDurationSeconds,
  type CircuitDesignVsMeasured,
  type FlagEvent,
  type PublicUser,
  type RegisterComponent,
} from '@cellwarden/shared';
import type { AlertsRepository } from '../alerts/alerts-repository';
import type { AlertsService } from '../alerts/alerts-service';
import type { Logger } from '../logger';
import type { SettingsRepository } from '../settings/settings-repository';
import type { StoredSystem } from '../systems/systems-repository';
import type { SystemsService } from '../systems/systems-service';
import type { InstallRegisterRepository, StoredCircuit } from './install-register-repository';
import { withVerdict } from './install-register-service';
import type { MeasuredChannel, MeasuredCurrentsRepository } from './measured-currents-repository';

/** Days of readings compared by default, and at most (raw readings are kept 31 days; a week covers a trip). */
export const DEFAULT_WINDOW_DAYS = 7;
export const MAX_WINDOW_DAYS = 14;

const FLAG = 'circuit-near-rating' as const;

function channelOf(circuit: StoredCircuit, components: RegisterComponent[]): MeasuredChannel | undefined {
  if (circuit.monitoring === 'battery-feed') return { kind: 'battery-feed' };
  const fed = components.find((c) => c.id === circuit.componentId)?.ratings;
  if (circuit.monitoring === 'source' && fed?.kind === 'charge-source' && fed.monitorSourceId)
    return { kind: 'source', sourceId: fed.monitorSourceId };
  return undefined;
}

/**
 * Design against measured: each circuit the monitor sees (the pack current for the main battery feed, a
 * source's reported current) compared with its fuse, its conductor and the BMS, over the last days of raw
 * readings; the worst standing opens, escalates or ends the system's `circuit-near-rating` flag.
 */
export function createDesignVsMeasuredService(deps: {
  register: InstallRegisterRepository;
  measured: MeasuredCurrentsRepository;
  systems: SystemsService;
  settings: SettingsRepository;
  alerts: AlertsService;
  alertsRepository: AlertsRepository;
  /** A system by id without a person (for the sweep). */
  findSystem: (id: string) => Promise<Pick<StoredSystem, 'id' | 'kind' | 'nominalVoltage'> | undefined>;
  logger: Logger;
  now: () => number;
}) {
  let timer: NodeJS.Timeout | undefined;

  async function compareCircuit(
    system: Pick<StoredSystem, 'id' | 'kind' | 'nominalVoltage'>,
    circuit: StoredCircuit,
    components: RegisterComponent[],
    from: number,
    to: number,
  ): Promise<CircuitDesignVsMeasured | undefined> {
    const channel = channelOf(circuit, components);
    if (!channel) return undefined;
    const stats = await deps.measured.windowStatistics(system.id, channel, from, to);
    const around = stats.peakAt === null ? [] : await deps.measured.around(system.id, channel, stats.peakAt);
    const peakSeconds = around.length > 0 ? peakDurationSeconds(around) : null;
    const verdict = withVerdict(circuit, components, system).verdict;
    const battery = components.find((c) => c.ratings.kind === 'battery')?.ratings;
    const settings = await deps.settings.find(system.id);
    const bms =
      channel.kind !== 'battery-feed'
        ? {}
        : battery?.kind === 'battery'
          ? { bmsContinuousA: battery.bmsContinuousA, bmsPeakA: battery.bmsPeakA }
          : { bmsContinuousA: settings?.bms.continuousDischargeA };
    const comparison = compareWithRatings(
      circuit.name,
      { samples: stats.samples, peakA: stats.peakA, peakSeconds, p99A: stats.p99A },
      {
        fuseA: circuit.protection.ratingA,
        protectionDevice: circuit.protection.device,
        conductorA: verdict.ampacityA,
        insulationRatingC: circuit.insulationRatingC,
        ...bms,
      },
    );
    return {
      circuitId: circuit.id,
      circuitName: circuit.name,
      samples: stats.samples,
      windowFrom: from,
      windowTo: to,
      peakA: stats.peakA,
      peakAt: stats.peakAt,
      peakSeconds,
      p99A: stats.p99A,
      comparisons: comparison.comparisons,
      insulationRatingC: circuit.insulationRatingC,
      protectionDevice: circuit.protection.device,
      standing: comparison.standing,
      sentence: comparison.sentence,
      worstPercent: comparison.worstPercent,
    } as CircuitDesignVsMeasured & { worstPercent: number | null };
  }

  async function evaluate(
    system: Pick<StoredSystem, 'id' | 'kind' | 'nominalVoltage'>,
    days: number,
  ): Promise<CircuitDesignVsMeasured[]> {
    const to = deps.now();
    const from = to - days * 86_400_000;
    const components = await deps.register.components(system.id);
    const results: (CircuitDesignVsMeasured & { worstPercent?: number | null })[] = [];
    for (const circuit of await deps.register.circuits(system.id)) {
      const result = await compareCircuit(system, circuit, components, from, to);
      if (result) results.push(result);
    }
    await updateFlag(system.id, results);
    return results.map(({ worstPercent: _worst, ...r }) => r);
  }

  async function updateFlag(
    systemId: string,
    results: (CircuitDesignVsMeasured & { worstPercent?: number | null })[],
  ) {
    const flagged = results.filter((r) => r.standing === 'close' || r.standing === 'over');
    const worst = flagged.reduce<(typeof flagged)[number] | undefined>(
      (a, b) => (a === undefined || (b.worstPercent ?? 0) > (a.worstPercent ?? 0) ? b : a),
      undefined,
    );
    const open = await deps.alertsRepository.findOpen(systemId, FLAG);
    const at = deps.now();
    const events: FlagEvent[] = [];
    if (worst) {
      const severity = flagged.some((r) => r.standing === 'over') ? 'critical' : 'warning';
      const value = Math.round((worst.worstPercent ?? 0) * 10) / 10;
      const peak = Math.max(value, open?.peakValue ?? 0);
      if (!open) events.push({ kind: FLAG, transition: 'start', severity, at, value, unit: '%', peak });
      else if (open.severity === 'warning' && severity === 'critical')
        events.push({ kind: FLAG, transition: 'escalate', severity, at, value, unit: '%', peak });
    } else if (open && results.every((r) => r.standing !== 'no-data')) {
      events.push({
        kind: FLAG,
        transition: 'end',
        severity: open.severity,
        at,
        value: 0,
        unit: '%',
        peak: open.peakValue ?? 0,
      });
    }
    if (events.length === 0) return;
    const settings = await deps.settings.find(systemId);
    await deps.alerts.record(
      systemId,
      { name: settings?.name ?? '', timeZone: settings?.timeZone ?? 'UTC' },
      events,
    );
  }

  return {
    /** The comparison for a person who may view the system (and the flag brought up to date). */
    async compare(user: PublicUser, systemId: string, days = DEFAULT_WINDOW_DAYS) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return evaluate(system, days);
    },

    /** Compares every system with a monitored circuit; one system's failure does not stop the others. */
    async sweep() {
      for (const id of await deps.register.monitoredSystemIds()) {
        try {
          const system = await deps.findSystem(id);
          if (system) await evaluate(system, DEFAULT_WINDOW_DAYS);
        } catch (error) {
          deps.logger.warn('design against measured not compared', { systemId: id, error: String(error) });
        }
      }
    },

    /** Sweeps every `intervalMs` until closed. */
    start(intervalMs: number) {
      timer = setInterval(() => {
        this.sweep().catch((error) => deps.logger.warn('design sweep failed', { error: String(error) }));
      }, intervalMs);
      timer.unref();
    },

    close() {
      if (timer) clearInterval(timer);
    },
  };
}

export type DesignVsMeasuredService = ReturnType<typeof createDesignVsMeasuredService>;
