// Column shapes every entity model repeats. Keys and times default in SQL (gen_random_uuid(), now()), so an
// insert through a model keeps them on the database's clock, as the migrations' own defaults do.
import { DataTypes, fn } from 'sequelize';

/** A uuid primary key the database generates. */
export const generatedUuidKey = () => ({
  type: DataTypes.UUID,
  primaryKey: true,
  defaultValue: fn('gen_random_uuid'),
});

/** A time column that defaults to the database's `now()` (created, updated, sent). */
export const databaseNow = () => ({ type: DataTypes.DATE, defaultValue: fn('now') });
