import type { PublicUser, RecordCheckChoice } from '@cellwarden/shared';
import type { AccountsRepository } from '../accounts/accounts-repository';
import type { AuditService } from '../audit/audit-service';
import { invalidInput } from '../errors/app-error';
import { commissioningRecordMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import { createRecordRenderer, type RecordRenderer } from '../records/isolated-record-renderer';
import {
  toRecordCheck,
  type CommissioningRecordCheck,
  type RecordChartPoint,
  type RecordCircuit,
  type RecordComponent,
} from '../records/commissioning-record-input';
import { recordCheckChoices } from '../records/record-check-choice';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { CommissioningRepository, StoredCheck } from './commissioning-repository';
import type { UploadsService } from './uploads-service';

/** What the record takes from the install register (server/src/install-register). */
export interface RegisterForRecord {
  sections(
    systemId: string,
  ): Promise<{ components: RecordComponent[]; circuits: RecordCircuit[] } | undefined>;
  sourceRatings(systemId: string): Promise<Map<string, number>>;
  chart(systemId: string, sourceId: string, from: number, to: number): Promise<RecordChartPoint[]>;
}

// Readings either side of the measured bulk phase drawn in a check's chart, so its start and end show.
const CHART_MARGIN_MS = 60_000;

/** The commissioning record: cover, register, chosen checks with charts, photos, cautions and signatures. */
export function createCommissioningRecordService(deps: {
  systems: SystemsService;
  settings: SettingsRepository;
  checks: CommissioningRepository;
  uploads: UploadsService;
  accounts: AccountsRepository;
  mailer: Mailer;
  audit: AuditService;
  now: () => number;
  installRegister?: RegisterForRecord;
  /** Defaults to a worker-thread renderer with the stated heap and time bounds. */
  renderer?: RecordRenderer;
}) {
  const renderer = deps.renderer ?? createRecordRenderer();

  async function choicesFor(systemId: string, stored: StoredCheck[]): Promise<RecordCheckChoice[]> {
    const settings = (await deps.settings.find(systemId))!;
    const registered = (await deps.installRegister?.sourceRatings(systemId)) ?? new Map<string, number>();
    const rating = (id: string) =>
      registered.get(id) ?? settings.chargeSources.find((s) => s.id === id)?.ratedCurrentA;
    return recordCheckChoices(stored, rating);
  }

  async function withChart(systemId: string, stored: StoredCheck): Promise<CommissioningRecordCheck | null> {
    const line = toRecordCheck(stored, (await deps.settings.find(systemId))!.chargeSources);
    if (!line || !deps.installRegister) return line;
    const from = stored.result?.measuredFrom ?? stored.startedAt;
    const to = stored.result?.measuredTo ?? stored.finishedAt ?? stored.startedAt;
    const chart = await deps.installRegister.chart(
      systemId,
      stored.sourceId,
      from - CHART_MARGIN_MS,
      to + CHART_MARGIN_MS,
    );
    return { ...line, chart };
  }

  async function render(user: PublicUser, systemId: string, chosen?: readonly string[]) {
    const system = await deps.systems.getFor(user, systemId, 'export');
    const settings = (await deps.settings.find(system.id))!;
    const stored = await deps.checks.list(system.id);
    const choices = await choicesFor(system.id, stored);
    const finished = new Set(choices.filter((c) => c.leftOutBecause !== 'unfinished').map((c) => c.checkId));
    for (const id of chosen ?? [])
      if (!finished.has(id))
        throw invalidInput('checks', `checks: ${id} is not a finished check of this system`);
    const picked = new Set(chosen ?? choices.filter((c) => c.byDefault).map((c) => c.checkId));
    const checks: CommissioningRecordCheck[] = [];
    for (const check of [...stored].reverse())
      if (picked.has(check.id)) {
        const line = await withChart(system.id, check);
        if (line) checks.push(line);
      }
    const company = user.companyId ? await deps.accounts.findCompany(user.companyId) : undefined;
    const owner = await deps.accounts.findById(system.ownerId);
    const register = await deps.installRegister?.sections(system.id);
    const pdf = await renderer.render({
      system: {
        name: settings.name,
        kind: settings.kind,
        battery: settings.battery,
        bms: { continuousDischargeA: settings.bms.continuousDischargeA },
        chargeSources: settings.chargeSources,
      },
      installer: { name: user.displayName, company: company?.name ?? '' },
      owner: owner ? { name: owner.displayName, email: owner.email } : undefined,
      components: register?.components,
      circuits: register?.circuits,
      recordedAt: deps.now(),
      timeZone: settings.timeZone,
      checks,
      photos: await deps.uploads.photos(system.id),
    });
    await deps.audit.record(system.id, user, 'readings.exported', 'commissioning record');
    return { pdf, system, settings, company, owner };
  }

  return {
    render: async (user: PublicUser, systemId: string, chosen?: readonly string[]) =>
      (await render(user, systemId, chosen)).pdf,

    /** The checks a record may carry, with those it carries by default. */
    async choices(user: PublicUser, systemId: string): Promise<RecordCheckChoice[]> {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return choicesFor(system.id, await deps.checks.list(system.id));
    },

    async emailToOwner(user: PublicUser, systemId: string, chosen?: readonly string[]): Promise<string> {
      await deps.systems.getFor(user, systemId, 'commission');
      const { pdf, system, settings, company, owner } = await render(user, systemId, chosen);
      const content = commissioningRecordMail({
        systemName: settings.name,
        installerName: user.displayName,
        companyName: company?.name ?? '',
        recordedAt: deps.now(),
        timeZone: settings.timeZone,
      });
      await deps.mailer.send({
        to: { name: owner!.displayName, address: owner!.email },
        ...content,
        attachments: [{ filename: 'commissioning-record.pdf', content: pdf, contentType: 'application/pdf' }],
      });
      await deps.audit.record(
        system.id,
        user,
        'commissioning.recorded',
        `record e-mailed to ${owner!.email}`,
      );
      return owner!.email;
    },
  };
}

export type CommissioningRecordService = ReturnType<typeof createCommissioningRecordService>;
