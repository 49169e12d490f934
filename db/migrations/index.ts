import type { Migration } from './migration';
import { createAccounts } from './2026.12.02T06.00.00.create-accounts';
import { createSystems } from './2026.12.02T06.10.00.create-systems';
import { createReadings } from './2026.12.02T06.20.00.create-readings';

/** Every migration, oldest first. Listed explicitly so the same code runs under tsx and jest. */
export const migrations: Migration[] = [createAccounts, createSystems, createReadings];
