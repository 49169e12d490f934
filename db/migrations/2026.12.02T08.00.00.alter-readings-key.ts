import { inTransaction, type Migration } from './migration';

/**
 * A reading is one device's measurement at one instant: two monitors on one bank measuring in the same
 * millisecond are two readings, while a device's own redelivery is still stored once.
 */
export const alterReadingsKey: Migration = {
  name: '2026.12.02T08.00.00.alter-readings-key',
  up: (sequelize) =>
    inTransaction(sequelize, [
      'ALTER TABLE readings DROP CONSTRAINT readings_pkey',
      'ALTER TABLE readings ADD PRIMARY KEY (system_id, measured_at, device_id)',
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      'ALTER TABLE readings DROP CONSTRAINT readings_pkey',
      'ALTER TABLE readings ADD PRIMARY KEY (system_id, measured_at)',
    ]),
};
