import type { PublicUser } from '@cellwarden/shared';
import type { AccountsRepository } from '../accounts/accounts-repository';
import type { AuditService } from '../audit/audit-service';
import { commissioningRecordMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import { createRecordRenderer, type RecordRenderer } from '../records/isolated-record-renderer';
import { toRecordCheck } from '../records/commissioning-record-input';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { CommissioningRepository } from './commissioning-repository';
import type { UploadsService } from './uploads-service';

/** The commissioning record: the system, its checks and photos as a PDF, downloaded or e-mailed to the owner. */
export function createCommissioningRecordService(deps: {
  systems: SystemsService;
  settings: SettingsRepository;
  checks: CommissioningRepository;
  uploads: UploadsService;
  accounts: AccountsRepository;
  mailer: Mailer;
  audit: AuditService;
  now: () => number;
  /** Defaults to a worker-thread renderer with the stated heap and time bounds. */
  renderer?: RecordRenderer;
}) {
  const renderer = deps.renderer ?? createRecordRenderer();
  async function render(user: PublicUser, systemId: string) {
    const system = await deps.systems.getFor(user, systemId, 'export');
    const settings = (await deps.settings.find(system.id))!;
    const checks = (await deps.checks.list(system.id))
      .map((check) => toRecordCheck(check, settings.chargeSources))
      .filter((check) => check !== null)
      .reverse();
    const company = user.companyId ? await deps.accounts.findCompany(user.companyId) : undefined;
    const pdf = await renderer.render({
      system: {
        name: settings.name,
        kind: settings.kind,
        battery: settings.battery,
        bms: { continuousDischargeA: settings.bms.continuousDischargeA },
        chargeSources: settings.chargeSources,
      },
      installer: { name: user.displayName, company: company?.name ?? '' },
      recordedAt: deps.now(),
      timeZone: settings.timeZone,
      checks,
      photos: await deps.uploads.photos(system.id),
    });
    await deps.audit.record(system.id, user, 'readings.exported', 'commissioning record');
    return { pdf, system, settings, company };
  }

  return {
    render: async (user: PublicUser, systemId: string) => (await render(user, systemId)).pdf,

    async emailToOwner(user: PublicUser, systemId: string): Promise<string> {
      await deps.systems.getFor(user, systemId, 'commission');
      const { pdf, system, settings, company } = await render(user, systemId);
      const owner = (await deps.accounts.findById(system.ownerId))!;
      const content = commissioningRecordMail({
        systemName: settings.name,
        installerName: user.displayName,
        companyName: company?.name ?? '',
        recordedAt: deps.now(),
        timeZone: settings.timeZone,
      });
      await deps.mailer.send({
        to: { name: owner.displayName, address: owner.email },
        ...content,
        attachments: [{ filename: 'commissioning-record.pdf', content: pdf, contentType: 'application/pdf' }],
      });
      await deps.audit.record(system.id, user, 'commissioning.recorded', `record e-mailed to ${owner.email}`);
      return owner.email;
    },
  };
}

export type CommissioningRecordService = ReturnType<typeof createCommissioningRecordService>;
