import {
  commissioningProgress,
  commissioningResult,
  feedCommissioning,
  startCommissioning,
  type BatteryReading,
  type CommissioningCheck,
  type CommissioningCheckRequest,
  type CommissioningResult,
  type CommissioningState,
  type PublicUser,
} from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { invalidInput, notFound } from '../errors/app-error';
import type { Logger } from '../logger';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { CommissioningRepository } from './commissioning-repository';
import { isUuid } from '../database/sql-values';

// Progress is written at most this often while a check runs; the dashboard polls it.
const PROGRESS_SAVE_MS = 1000;

interface RunningCheck {
  id: string;
  systemId: string;
  state: CommissioningState;
  savedAt: number;
  timeout: NodeJS.Timeout;
}

/** The figures a finished check stores, in the API's shape. */
export function toCheckResult(result: CommissioningResult): NonNullable<CommissioningCheck['result']> {
  return {
    meanCurrentA: result.bulk?.meanCurrentA ?? null,
    minCurrentA: result.bulk?.minCurrentA ?? null,
    maxCurrentA: result.bulk?.maxCurrentA ?? null,
    ripplePeakToPeakA: result.bulk?.ripplePeakToPeakA ?? null,
    batteryVoltageReached: result.bulk?.batteryVoltageReachedV ?? null,
    cableDropV: result.cableDrop?.volts ?? null,
    reasons: result.verdict.findings.map((f) => f.message),
    measuredFrom: result.bulk?.startedAt,
    measuredTo: result.bulk?.endedAt,
  };
}

/**
 * Commissioning checks: an installer starts one for a charge source; the server watches the system's live
 * readings through the shared tracker until it has a verdict or the window closes.
 */
export function createCommissioningService(deps: {
  repository: CommissioningRepository;
  settings: SettingsRepository;
  systems: SystemsService;
  audit: AuditService;
  logger: Logger;
  now: () => number;
  /** The rated current the install register gives a charge source, which a check then takes. */
  registeredRatingA?: (systemId: string, sourceId: string) => Promise<number | undefined>;
}) {
  const running = new Map<string, RunningCheck>();

  async function finish(check: RunningCheck) {
    running.delete(check.id);
    clearTimeout(check.timeout);
    const result = commissioningResult(check.state);
    const status = check.state.phase === 'done' && result.verdict.ok ? 'passed' : 'failed';
    await deps.repository.finish(check.id, status, commissioningProgress(check.state), toCheckResult(result));
  }

  return {
    async start(
      user: PublicUser,
      systemId: string,
      asked: Omit<CommissioningCheckRequest, 'ratedCurrentA'> & { ratedCurrentA?: number },
    ) {
      const system = await deps.systems.getFor(user, systemId, 'commission');
      const ratedCurrentA =
        (await deps.registeredRatingA?.(system.id, asked.sourceId)) ?? asked.ratedCurrentA;
      if (ratedCurrentA === undefined)
        throw invalidInput(
          'ratedCurrentA',
          'ratedCurrentA is required: the install register gives no rating for this charge source',
        );
      const request: CommissioningCheckRequest = { ...asked, ratedCurrentA };
      const settings = (await deps.settings.find(system.id))!;
      if (!settings.chargeSources.some((s) => s.id === request.sourceId))
        throw invalidInput(
          'sourceId',
          `No charge source "${request.sourceId}" on this system; add it in the settings first`,
        );
      for (const check of running.values())
        if (check.systemId === system.id)
          throw invalidInput('sourceId', 'A check is already running on this system; wait for it to finish');
      const state = startCommissioning({
        ratedCurrentA: request.ratedCurrentA,
        tolerancePercent: request.tolerancePercent,
        sourceOutputVoltage: request.sourceOutputVoltage,
        batteryTerminalVoltage: request.batteryTerminalVoltage,
        gauge: request.gauge as never,
        oneWayLengthM: request.oneWayLengthM,
        sourceId: request.sourceId,
        measureSeconds: Math.min(60, Math.floor(request.windowSeconds / 2)),
      });
      const id = await deps.repository.insert(system.id, user.id, request, commissioningProgress(state));
      const check: RunningCheck = {
        id,
        systemId: system.id,
        state,
        savedAt: deps.now(),
        timeout: undefined as never,
      };
      check.timeout = setTimeout(
        () => void finish(check).catch((e) => deps.logger.error('check not finished', { e: String(e) })),
        request.windowSeconds * 1000,
      );
      check.timeout.unref();
      running.set(id, check);
      await deps.audit.record(
        system.id,
        user,
        'commissioning.recorded',
        `check of ${request.sourceId} started`,
      );
      return (await deps.repository.find(system.id, id))!;
    },

    /** Feeds a stored reading to the checks running on its system. */
    onReading(systemId: string, reading: BatteryReading) {
      for (const check of running.values()) {
        if (check.systemId !== systemId) continue;
        check.state = feedCommissioning(check.state, reading);
        if (check.state.phase === 'done')
          void finish(check).catch((e) => deps.logger.error('check not finished', { e: String(e) }));
        else if (deps.now() - check.savedAt >= PROGRESS_SAVE_MS) {
          check.savedAt = deps.now();
          void deps.repository.saveProgress(check.id, commissioningProgress(check.state));
        }
      }
    },

    async list(user: PublicUser, systemId: string) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return (await deps.repository.list(system.id)).map(({ request: _request, ...check }) => check);
    },

    async get(user: PublicUser, systemId: string, checkId: string) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      const check = isUuid(checkId) ? await deps.repository.find(system.id, checkId) : undefined;
      if (!check) throw notFound('Commissioning check');
      const { request: _request, ...rest } = check;
      return rest;
    },

    close() {
      for (const check of running.values()) clearTimeout(check.timeout);
      running.clear();
    },
  };
}

export type CommissioningService = ReturnType<typeof createCommissioningService>;
