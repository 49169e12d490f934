import { inTransaction, type Migration } from './migration';

/** Alert events (a flag from start to end) and the e-mail notices sent about them. */
export const createAlerts: Migration = {
  name: '2026.12.02T07.20.00.create-alerts',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE alert_events (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        kind text NOT NULL,
        severity text NOT NULL CHECK (severity IN ('warning','critical')),
        started_at timestamptz NOT NULL,
        ended_at timestamptz,
        peak_value double precision,
        unit text NOT NULL DEFAULT '',
        acknowledged_at timestamptz,
        acknowledged_by uuid REFERENCES users(id) ON DELETE SET NULL,
        note text CHECK (length(note) <= 500)
      )`,
      `CREATE INDEX alert_events_system_started_idx ON alert_events (system_id, started_at DESC)`,
      // At most one open event per system and flag kind: a restart that replays a start cannot duplicate it.
      `CREATE UNIQUE INDEX alert_events_open_key ON alert_events (system_id, kind) WHERE ended_at IS NULL`,
      `CREATE TABLE alert_notices (
        id bigserial PRIMARY KEY,
        alert_id uuid NOT NULL REFERENCES alert_events(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        transition text NOT NULL CHECK (transition IN ('start','end')),
        sent_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX alert_notices_user_sent_idx ON alert_notices (user_id, sent_at DESC)`,
    ]),
  down: (sequelize) => inTransaction(sequelize, ['DROP TABLE alert_notices', 'DROP TABLE alert_events']),
};
