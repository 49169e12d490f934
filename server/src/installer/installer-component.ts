import type { Sequelize } from 'sequelize';
import type { AccountsRepository } from '../accounts/accounts-repository';
import type { AuditService } from '../audit/audit-service';
import type { InstallRegisterComponent } from '../install-register/install-register-component';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsRepository } from '../telemetry/readings-repository';
import { createUploadStorage } from '../uploads/upload-storage';
import { createCommissioningRecordService } from './commissioning-record-service';
import type { CommissioningRepository } from './commissioning-repository';
import { createCommissioningService } from './commissioning-service';
import { createEnergyBudgetsService } from './energy-budgets-service';
import { createInstallerRoutes } from './installer-routes';
import type { UploadsRepository } from './uploads-repository';
import { createUploadsService } from './uploads-service';

/**
 * The installer tools: commissioning checks (fed by every stored reading), uploads, the commissioning record and
 * energy budgets. Checks left running by a previous process are marked abandoned before any new one starts.
 */
export async function createInstallerComponent(deps: {
  sequelize: Sequelize;
  repository: CommissioningRepository;
  uploads: UploadsRepository;
  settings: SettingsRepository;
  readings: ReadingsRepository;
  accounts: AccountsRepository;
  systems: SystemsService;
  audit: AuditService;
  installRegister: InstallRegisterComponent;
  mailer: Mailer;
  uploadDir: string;
  logger: Logger;
  now: () => number;
}) {
  const { systems, audit, now } = deps;
  await deps.repository.abandonRunning();
  const checks = createCommissioningService({
    repository: deps.repository,
    settings: deps.settings,
    systems,
    audit,
    logger: deps.logger,
    now,
    registeredRatingA: (systemId, sourceId) =>
      deps.installRegister.register.sourceRatingA(systemId, sourceId),
  });
  const uploadStorage = createUploadStorage({ root: deps.uploadDir });
  const uploads = createUploadsService({ repository: deps.uploads, storage: uploadStorage, systems, audit });
  const routes = createInstallerRoutes({
    checks,
    uploads,
    uploadMiddleware: uploadStorage.middleware(),
    record: createCommissioningRecordService({
      systems,
      settings: deps.settings,
      checks: deps.repository,
      uploads,
      accounts: deps.accounts,
      mailer: deps.mailer,
      audit,
      now,
      installRegister: deps.installRegister.forRecord,
    }),
    budgets: createEnergyBudgetsService({ sequelize: deps.sequelize, systems, readings: deps.readings, now }),
  });
  return { checks, routes };
}
