import type { Migration } from './migration';
import { createAccounts } from './2026.12.02T06.00.00.create-accounts';
import { createSystems } from './2026.12.02T06.10.00.create-systems';
import { createReadings } from './2026.12.02T06.20.00.create-readings';
import { createAccess } from './2026.12.02T07.00.00.create-access';
import { createRollups } from './2026.12.02T07.10.00.create-rollups';
import { createAlerts } from './2026.12.02T07.20.00.create-alerts';
import { createInstallerRecords } from './2026.12.02T07.30.00.create-installer-records';
import { alterReadingsKey } from './2026.12.02T08.00.00.alter-readings-key';
import { createSignInSessions } from './2026.12.03T09.00.00.create-sign-in-sessions';
import { alterRollups } from './2026.12.03T12.50.00.alter-rollups';
import { alterGrantsEmail } from './2026.12.03T13.20.00.alter-grants-email';
import { createBatteryHealth } from './2026.12.03T16.10.00.create-battery-health';
import { createOnboardingAndRequests } from './2026.12.03T16.20.00.create-onboarding-and-requests';
import { createInstallRegister } from './2026.12.03T16.30.00.create-install-register';

/** Every migration, oldest first. Listed explicitly so the same code runs under tsx and jest. */
export const migrations: Migration[] = [
  createAccounts,
  createSystems,
  createReadings,
  createAccess,
  createRollups,
  createAlerts,
  createInstallerRecords,
  alterReadingsKey,
  createSignInSessions,
  alterRollups,
  alterGrantsEmail,
  createBatteryHealth,
  createOnboardingAndRequests,
  createInstallRegister,
];
