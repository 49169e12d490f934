import {
  capacityTrend,
  createLifeCycleAccumulator,
  healthWords,
  type BatteryHealthResponse,
  type LifeCycleFigures,
  type PublicUser,
} from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { BatteryHealthRepository } from './battery-health-repository';
import { HEALTH_METHOD, lateDataNote } from './health-method';
import type { HealthReportInput, TemperatureUnitCode } from './health-report-input';

const HOUR_MS = 3600_000;
const PAGE_HOURS = 5000;

/** The battery health of a system for the screen, and its report for a chosen period. */
export function createBatteryHealthService(deps: {
  systems: SystemsService;
  settings: SettingsRepository;
  repository: BatteryHealthRepository;
  audit: AuditService;
  now: () => number;
}) {
  const { repository } = deps;

  /** Life-cycle figures of [from, to) straight from the hour rollups, read a page at a time. */
  async function figuresOfPeriod(systemId: string, usableAh: number, from: number, to: number) {
    const accumulator = createLifeCycleAccumulator(usableAh);
    let first: number | undefined;
    let last: number | undefined;
    for (let cursor = from; ;) {
      const hours = await repository.completeHours(systemId, { from: cursor, to }, PAGE_HOURS);
      for (const hour of hours) accumulator.push(hour);
      if (hours.length > 0) {
        first ??= hours[0].start;
        last = hours[hours.length - 1].start + HOUR_MS;
      }
      if (hours.length < PAGE_HOURS) break;
      cursor = hours[hours.length - 1].start + HOUR_MS;
    }
    return {
      figures: accumulator.figures(),
      covered: first === undefined ? null : { from: first, to: last! },
    };
  }

  return {
    /** What the screen shows: the checkpointed figures and every capacity sample, never the raw readings. */
    async overview(
      user: PublicUser,
      systemId: string,
      locale: string,
      unit: TemperatureUnitCode = 'C',
    ): Promise<BatteryHealthResponse> {
      const { system, access } = await deps.systems.openFor(user, systemId, 'view');
      const settings = (await deps.settings.find(system.id))!;
      const checkpoint = await repository.findCheckpoint(system.id);
      const samples = await repository.listSamples(system.id);
      const trend = capacityTrend(samples, system.usableCapacityAh, settings.timeZone);
      const figures: LifeCycleFigures | null = checkpoint?.lifecycleState
        ? createLifeCycleAccumulator(checkpoint.usableAh, checkpoint.lifecycleState).figures()
        : null;
      const period =
        checkpoint?.coveredFrom != null && checkpoint.hoursThrough != null
          ? { from: checkpoint.coveredFrom, to: checkpoint.hoursThrough }
          : null;
      return {
        systemId: system.id,
        systemName: settings.name,
        chemistry: system.chemistry,
        nominalVoltage: system.nominalVoltage,
        ratedCapacityAh: system.ratedCapacityAh,
        usableCapacityAh: system.usableCapacityAh,
        timeZone: settings.timeZone,
        period,
        capacity: trend,
        sampleCount: samples.length,
        figures,
        words: figures ? healthWords(trend, figures, locale, unit) : [],
        method: HEALTH_METHOD,
        mayExport: access.allowed.has('export'),
        lateDataNote: lateDataNote(checkpoint?.lateRebuilds ?? 0),
      };
    },

    /** The report's content for [from, to): samples and figures of that period only; the download is audited. */
    async report(
      user: PublicUser,
      systemId: string,
      period: { from: number; to: number; format: 'pdf' | 'csv'; locale: string; unit?: TemperatureUnitCode },
    ): Promise<HealthReportInput> {
      const system = await deps.systems.getFor(user, systemId, 'export');
      const settings = (await deps.settings.find(system.id))!;
      const samples = await repository.listSamples(system.id, period);
      const trend = capacityTrend(samples, system.usableCapacityAh, settings.timeZone);
      const { figures, covered } = await figuresOfPeriod(
        system.id,
        system.usableCapacityAh,
        period.from,
        period.to,
      );
      await deps.audit.record(
        system.id,
        user,
        'readings.exported',
        `battery health report (${period.format.toUpperCase()}) ${new Date(period.from).toISOString()} – ${new Date(period.to).toISOString()}`,
      );
      return {
        system: {
          name: settings.name,
          kind: settings.kind,
          chemistry: system.chemistry,
          nominalVoltage: system.nominalVoltage,
          ratedCapacityAh: system.ratedCapacityAh,
          usableCapacityAh: system.usableCapacityAh,
        },
        timeZone: settings.timeZone,
        requested: { from: period.from, to: period.to },
        covered,
        madeAt: deps.now(),
        trend,
        samples,
        figures,
        words: covered ? healthWords(trend, figures, period.locale, period.unit ?? 'C') : [],
        method: HEALTH_METHOD,
        unit: period.unit ?? 'C',
      };
    },
  };
}

export type BatteryHealthService = ReturnType<typeof createBatteryHealthService>;
