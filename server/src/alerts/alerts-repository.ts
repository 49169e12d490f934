import { QueryTypes, type Sequelize } from 'sequelize';
import {
  DEFAULT_EMAIL_FLAGS,
  type AlertEvent,
  type FlagEpisode,
  type FlagKind,
  type FlagSeverity,
} from '@cellwarden/shared';
import { epochMs as ms } from '../database/sql-values';

const SELECT_ALERT = `SELECT a.id, a.system_id AS "systemId", a.kind, a.severity,
  ${ms('a.started_at')} AS "startedAt", ${ms('a.ended_at')} AS "endedAt", a.peak_value AS "peakValue", a.unit,
  ${ms('a.acknowledged_at')} AS "acknowledgedAt",
  CASE WHEN u.id IS NULL THEN NULL ELSE json_build_object('id', u.id, 'displayName', u.display_name) END AS "acknowledgedBy",
  a.note
  FROM alert_events a LEFT JOIN users u ON u.id = a.acknowledged_by`;

/** Data access for alert events and the notices sent about them. */
export function createAlertsRepository(sequelize: Sequelize) {
  const select = (sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<AlertEvent>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    /** Opens an event; an event already open for the kind (e.g. after a restart) is returned instead. */
    async open(event: {
      systemId: string;
      kind: FlagKind;
      severity: FlagSeverity;
      startedAt: number;
      peakValue: number;
      unit: string;
    }): Promise<{ alert: AlertEvent; created: boolean }> {
      const inserted = await select(
        `INSERT INTO alert_events (system_id, kind, severity, started_at, peak_value, unit)
         VALUES (:systemId, :kind, :severity, to_timestamp(:startedAt / 1000.0), :peakValue, :unit)
         ON CONFLICT (system_id, kind) WHERE ended_at IS NULL DO NOTHING RETURNING id`,
        event,
      );
      const alert = (await this.findOpen(event.systemId, event.kind))!;
      return { alert, created: inserted.length > 0 };
    },

    /** Records a past episode found in a late backlog, unless an event of its kind already overlaps it. */
    async insertPastEpisode(systemId: string, episode: FlagEpisode): Promise<AlertEvent | undefined> {
      const rows = await select(
        `INSERT INTO alert_events (system_id, kind, severity, started_at, ended_at, peak_value, unit)
         SELECT :systemId, :kind, :severity, to_timestamp(:startedAt / 1000.0), to_timestamp(:endedAt / 1000.0), :peak, :unit
         WHERE NOT EXISTS (
           SELECT 1 FROM alert_events WHERE system_id = :systemId AND kind = :kind
             AND started_at <= to_timestamp(:endedAt / 1000.0)
             AND coalesce(ended_at, 'infinity') >= to_timestamp(:startedAt / 1000.0))
         RETURNING id`,
        { systemId, ...episode },
      );
      return rows[0] && (await select(`${SELECT_ALERT} WHERE a.id = :id`, { id: rows[0].id }))[0];
    },

    async findOpen(systemId: string, kind: FlagKind): Promise<AlertEvent | undefined> {
      return (
        await select(
          `${SELECT_ALERT} WHERE a.system_id = :systemId AND a.kind = :kind AND a.ended_at IS NULL`,
          { systemId, kind },
        )
      )[0];
    },

    /** Updates an open event's severity and peak, or closes it; answers the event as it now stands. */
    async update(
      systemId: string,
      kind: FlagKind,
      change: { severity: FlagSeverity; peakValue: number; endedAt?: number },
    ): Promise<AlertEvent | undefined> {
      const rows = await select(
        `UPDATE alert_events SET severity = :severity, peak_value = :peakValue,
           ended_at = CASE WHEN :endedAt::float8 IS NULL THEN NULL ELSE to_timestamp(:endedAt::float8 / 1000.0) END
         WHERE system_id = :systemId AND kind = :kind AND ended_at IS NULL RETURNING id`,
        { systemId, kind, ...change, endedAt: change.endedAt ?? null },
      );
      return rows[0] && (await select(`${SELECT_ALERT} WHERE a.id = :id`, { id: rows[0].id }))[0];
    },

    list: (systemId: string, from: Date, to: Date, activeOnly: boolean, limit: number) =>
      select(
        `${SELECT_ALERT} WHERE a.system_id = :systemId
           AND (:activeOnly AND a.ended_at IS NULL OR NOT :activeOnly AND a.started_at <= :to
             AND (a.ended_at IS NULL OR a.ended_at >= :from))
         ORDER BY a.started_at DESC LIMIT :limit`,
        { systemId, from, to, activeOnly, limit },
      ),

    async acknowledge(
      systemId: string,
      alertId: string,
      userId: string,
      note: string,
    ): Promise<AlertEvent | undefined> {
      const rows = await select(
        `UPDATE alert_events SET acknowledged_at = now(), acknowledged_by = :userId, note = :note
         WHERE system_id = :systemId AND id = :alertId RETURNING id`,
        { systemId, alertId, userId, note },
      );
      return rows[0] && (await select(`${SELECT_ALERT} WHERE a.id = :id`, { id: alertId }))[0];
    },

    /** Open alert kinds per system, for the fleet list. */
    openKinds: (systemIds: string[]) =>
      systemIds.length === 0
        ? Promise.resolve([])
        : sequelize.query<{ systemId: string; kind: FlagKind; severity: FlagSeverity }>(
            `SELECT system_id AS "systemId", kind, severity FROM alert_events
             WHERE ended_at IS NULL AND system_id IN (:systemIds)`,
            { replacements: { systemIds }, type: QueryTypes.SELECT },
          ),

    /** Notices already sent to a person in the last hour, and whether this transition was already told. */
    async noticeAllowance(userId: string, alertId: string, transition: 'start' | 'end') {
      const [row] = await sequelize.query<{ lastHour: number; already: boolean }>(
        `SELECT count(*) FILTER (WHERE sent_at > now() - interval '1 hour')::int AS "lastHour",
           bool_or(alert_id = :alertId AND transition = :transition) AS already
         FROM alert_notices WHERE user_id = :userId`,
        { replacements: { userId, alertId, transition }, type: QueryTypes.SELECT },
      );
      return { lastHour: row?.lastHour ?? 0, already: row?.already ?? false };
    },

    async recordNotice(userId: string, alertId: string, transition: 'start' | 'end') {
      await sequelize.query(
        `INSERT INTO alert_notices (alert_id, user_id, transition) VALUES (:alertId, :userId, :transition)`,
        { replacements: { userId, alertId, transition } },
      );
    },

    /** Who hears about a system's flags: its owner and the people it was granted to by name, with their opt-ins. */
    recipients: (systemId: string, now: number) =>
      sequelize.query<{ userId: string; email: string; displayName: string; emailFlags: FlagKind[] }>(
        `SELECT u.id AS "userId", u.email, u.display_name AS "displayName",
           coalesce(p.email_flags, ARRAY[:defaultFlags]::text[]) AS "emailFlags"
         FROM users u LEFT JOIN user_preferences p ON p.user_id = u.id
         WHERE u.id = (SELECT owner_id FROM systems WHERE id = :systemId)
            OR u.id IN (SELECT grantee_user_id FROM grants WHERE system_id = :systemId AND revoked_at IS NULL
                          AND expires_at > to_timestamp(:now / 1000.0))`,
        { replacements: { systemId, now, defaultFlags: [...DEFAULT_EMAIL_FLAGS] }, type: QueryTypes.SELECT },
      ),
  };
}

export type AlertsRepository = ReturnType<typeof createAlertsRepository>;
