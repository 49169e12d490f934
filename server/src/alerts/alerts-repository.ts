import { Op, QueryTypes, fn, type Sequelize, type WhereOptions } from 'sequelize';
import {
  DEFAULT_EMAIL_FLAGS,
  type AlertEvent,
  type FlagEpisode,
  type FlagKind,
  type FlagSeverity,
} from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { SystemAlert } from './alert-models';

// Opens an alert unless one of its kind is open already. SQL because the guard is the partial unique index
// (system_id, kind) WHERE ended_at IS NULL, and `created` must tell whether this call made the row: a model's
// insert cannot say ON CONFLICT … DO NOTHING RETURNING and report which it was.
const OPEN_ALERT_SQL = `INSERT INTO alert_events (system_id, kind, severity, started_at, peak_value, unit)
  VALUES (:systemId, :kind, :severity, to_timestamp(:startedAt / 1000.0), :peakValue, :unit)
  ON CONFLICT (system_id, kind) WHERE ended_at IS NULL DO NOTHING RETURNING id`;

// A past episode from a late backlog, inserted only when no event of its kind overlaps it. SQL because the
// overlap check and the insert are one statement (INSERT … SELECT … WHERE NOT EXISTS), so two batches cannot
// both insert it.
const INSERT_PAST_EPISODE_SQL = `INSERT INTO alert_events (system_id, kind, severity, started_at, ended_at, peak_value, unit)
  SELECT :systemId, :kind, :severity, to_timestamp(:startedAt / 1000.0), to_timestamp(:endedAt / 1000.0), :peak, :unit
  WHERE NOT EXISTS (
    SELECT 1 FROM alert_events WHERE system_id = :systemId AND kind = :kind
      AND started_at <= to_timestamp(:endedAt / 1000.0)
      AND coalesce(ended_at, 'infinity') >= to_timestamp(:startedAt / 1000.0))
  RETURNING id`;

// A person's notices in the last hour and whether this transition was told already, in one pass over their
// notices (count(*) FILTER, bool_or): aggregates a model's finder does not say.
const NOTICE_ALLOWANCE_SQL = `SELECT count(*) FILTER (WHERE sent_at > now() - interval '1 hour')::int AS "lastHour",
    bool_or(alert_id = :alertId AND transition = :transition) AS already
  FROM alert_notices WHERE user_id = :userId`;

// Owner and named grantees of a system with their e-mail opt-ins, the default list where they saved none. SQL
// for the one statement across users, preferences, systems and grants with the default as an array literal.
const RECIPIENTS_SQL = `SELECT u.id AS "userId", u.email, u.display_name AS "displayName",
    coalesce(p.email_flags, ARRAY[:defaultFlags]::text[]) AS "emailFlags"
  FROM users u LEFT JOIN user_preferences p ON p.user_id = u.id
  WHERE u.id = (SELECT owner_id FROM systems WHERE id = :systemId)
     OR u.id IN (SELECT grantee_user_id FROM grants WHERE system_id = :systemId AND revoked_at IS NULL
                   AND expires_at > to_timestamp(:now / 1000.0))`;

const time = (value: Date | null | undefined) => value?.getTime() ?? null;

/** The API's view of an alert event. */
function toAlertEvent(row: SystemAlert): AlertEvent {
  const { acknowledger } = row;
  return {
    id: row.id,
    systemId: row.systemId,
    kind: row.kind,
    severity: row.severity,
    startedAt: row.startedAt.getTime(),
    endedAt: time(row.endedAt),
    peakValue: row.peakValue,
    unit: row.unit,
    acknowledgedAt: time(row.acknowledgedAt),
    acknowledgedBy: acknowledger ? { id: acknowledger.id, displayName: acknowledger.displayName } : null,
    note: row.note ?? null,
  };
}

/** Data access for alert events and the notices sent about them. */
export function createAlertsRepository(sequelize: Sequelize) {
  const { SystemAlert, AlertNotice, User } = initModels(sequelize);
  const acknowledger = { model: User, as: 'acknowledger', attributes: ['id', 'displayName'] };
  const findAll = async (where: WhereOptions, extra: { limit?: number } = {}) =>
    (
      await SystemAlert.findAll({ where, include: [acknowledger], order: [['startedAt', 'DESC']], ...extra })
    ).map(toAlertEvent);
  const findById = async (id: string) => {
    const row = await SystemAlert.findByPk(id, { include: [acknowledger] });
    return row ? toAlertEvent(row) : undefined;
  };
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
      const inserted = await sequelize.query(OPEN_ALERT_SQL, {
        replacements: event,
        type: QueryTypes.SELECT,
      });
      const alert = (await this.findOpen(event.systemId, event.kind))!;
      return { alert, created: inserted.length > 0 };
    },

    /** Records a past episode found in a late backlog, unless an event of its kind already overlaps it. */
    async insertPastEpisode(systemId: string, episode: FlagEpisode): Promise<AlertEvent | undefined> {
      const rows = await sequelize.query<{ id: string }>(INSERT_PAST_EPISODE_SQL, {
        replacements: { systemId, ...episode },
        type: QueryTypes.SELECT,
      });
      return rows[0] && findById(rows[0].id);
    },

    async findOpen(systemId: string, kind: FlagKind): Promise<AlertEvent | undefined> {
      const row = await SystemAlert.scope('active').findOne({
        where: { systemId, kind },
        include: [acknowledger],
      });
      return row ? toAlertEvent(row) : undefined;
    },

    /** Updates an open event's severity and peak, or closes it; answers the event as it now stands. */
    async update(
      systemId: string,
      kind: FlagKind,
      change: { severity: FlagSeverity; peakValue: number; endedAt?: number },
    ): Promise<AlertEvent | undefined> {
      const [, rows] = await SystemAlert.scope('active').update(
        {
          severity: change.severity,
          peakValue: change.peakValue,
          endedAt: change.endedAt === undefined ? null : new Date(change.endedAt),
        },
        { where: { systemId, kind }, returning: ['id'] },
      );
      return rows[0] && findById(rows[0].id);
    },

    list: (systemId: string, from: Date, to: Date, activeOnly: boolean, limit: number) =>
      findAll(
        activeOnly
          ? { systemId, endedAt: null }
          : {
              systemId,
              startedAt: { [Op.lte]: to },
              [Op.or]: [{ endedAt: null }, { endedAt: { [Op.gte]: from } }],
            },
        { limit },
      ),

    async acknowledge(
      systemId: string,
      alertId: string,
      userId: string,
      note: string,
    ): Promise<AlertEvent | undefined> {
      const [count] = await SystemAlert.update(
        { acknowledgedAt: fn('now'), acknowledgedBy: userId, note },
        { where: { systemId, id: alertId } },
      );
      return count > 0 ? findById(alertId) : undefined;
    },

    /** Open alert kinds per system, for the fleet list. */
    openKinds: (
      systemIds: string[],
    ): Promise<{ systemId: string; kind: FlagKind; severity: FlagSeverity }[]> =>
      systemIds.length === 0
        ? Promise.resolve([])
        : SystemAlert.scope('active').findAll({
            where: { systemId: systemIds },
            attributes: ['systemId', 'kind', 'severity'],
            raw: true,
          }),

    /** Notices already sent to a person in the last hour, and whether this transition was already told. */
    async noticeAllowance(userId: string, alertId: string, transition: 'start' | 'end') {
      const [row] = await sequelize.query<{ lastHour: number; already: boolean }>(NOTICE_ALLOWANCE_SQL, {
        replacements: { userId, alertId, transition },
        type: QueryTypes.SELECT,
      });
      return { lastHour: row?.lastHour ?? 0, already: row?.already ?? false };
    },

    async recordNotice(userId: string, alertId: string, transition: 'start' | 'end') {
      await AlertNotice.create({ alertId, userId, transition }, { returning: false });
    },

    /** Who hears about a system's flags: its owner and the people it was granted to by name, with their opt-ins. */
    recipients: (systemId: string, now: number) =>
      sequelize.query<{ userId: string; email: string; displayName: string; emailFlags: FlagKind[] }>(
        RECIPIENTS_SQL,
        { replacements: { systemId, now, defaultFlags: [...DEFAULT_EMAIL_FLAGS] }, type: QueryTypes.SELECT },
      ),
  };
}

export type AlertsRepository = ReturnType<typeof createAlertsRepository>;
