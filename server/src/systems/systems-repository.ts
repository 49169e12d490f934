import { QueryTypes, type Sequelize } from 'sequelize';
import type { SystemSummary } from '@cellwarden/shared';
import { LEAD_MONITOR_SQL } from '../telemetry/lead-monitor';

/** A system as stored: what the API shows, plus who owns and services it (for the access rule). */
export interface StoredSystem extends SystemSummary {
  ownerId: string;
  installerCompanyId: string | null;
}

/** A system as far as the access rule is concerned. */
export type OwnedSystem = Pick<StoredSystem, 'id' | 'ownerId' | 'installerCompanyId'>;

/** Who is asking for a list: their own systems, their company's when they fit or administer, and grants. */
export interface Visibility {
  userId: string;
  companyId: string | null;
  seesCompanySystems: boolean;
  now: number;
}

// The latest reading is the lead monitor's when it has one (see lead-monitor.ts), else the newest of any monitor.
const SELECT_SYSTEM = `
  SELECT s.id, s.name, s.kind, s.chemistry, s.nominal_voltage AS "nominalVoltage",
    s.rated_capacity_ah AS "ratedCapacityAh", s.usable_capacity_ah AS "usableCapacityAh",
    s.owner_id AS "ownerId", s.installer_company_id AS "installerCompanyId",
    CASE WHEN r.measured_at IS NULL THEN NULL ELSE json_build_object(
      'measuredAt', (extract(epoch FROM r.measured_at) * 1000)::bigint,
      'receivedAt', (extract(epoch FROM r.received_at) * 1000)::bigint,
      'voltage', r.voltage, 'current', r.current, 'temperature', r.temperature,
      'stateOfCharge', r.state_of_charge, 'power', r.power, 'sourceCurrents', r.source_currents,
      'deviceId', r.device_id) END AS "latestReading",
    (SELECT coalesce(json_agg(json_build_object('kind', a.kind, 'severity', a.severity)
        ORDER BY a.severity = 'critical' DESC, a.started_at), '[]'::json)
      FROM alert_events a WHERE a.system_id = s.id AND a.ended_at IS NULL) AS "activeFlags",
    (SELECT (extract(epoch FROM max(d.last_seen_at)) * 1000)::float8 FROM devices d WHERE d.system_id = s.id) AS "lastSeenAt"
  FROM systems s
  LEFT JOIN LATERAL (
    SELECT * FROM (
      (SELECT *, 0 AS preference FROM readings WHERE system_id = s.id AND device_id = ${LEAD_MONITOR_SQL('s.id')}
        ORDER BY measured_at DESC LIMIT 1)
      UNION ALL
      (SELECT *, 1 FROM readings WHERE system_id = s.id ORDER BY measured_at DESC LIMIT 1)
    ) latest ORDER BY preference LIMIT 1
  ) r ON true`;

// The summary above costs about 2 ms (its latest reading looks through the monitors' partitions); a route that
// only needs to know whether the asker may see the system reads this instead.
const SELECT_OWNERSHIP = `SELECT id, owner_id AS "ownerId", installer_company_id AS "installerCompanyId"
  FROM systems WHERE id = :id`;

function stripNulls(summary: StoredSystem): StoredSystem {
  const reading = summary.latestReading as Record<string, unknown> | null;
  if (reading) for (const key of Object.keys(reading)) if (reading[key] === null) delete reading[key];
  return summary;
}

/** Data access for systems; the fleet list is read from `reader` (a replica) when given. */
export function createSystemsRepository(sequelize: Sequelize, reader: Sequelize = sequelize) {
  return {
    async listVisible(visibility: Visibility): Promise<StoredSystem[]> {
      const rows = await reader.query<StoredSystem>(
        `${SELECT_SYSTEM} WHERE s.owner_id = :userId
           OR (:seesCompany AND s.installer_company_id IS NOT NULL AND s.installer_company_id = :companyId)
           OR EXISTS (SELECT 1 FROM grants g WHERE g.system_id = s.id AND g.revoked_at IS NULL
             AND g.expires_at > to_timestamp(:now / 1000.0)
             AND (g.grantee_user_id = :userId OR g.grantee_company_id = :companyId))
         ORDER BY s.name`,
        {
          replacements: {
            userId: visibility.userId,
            companyId: visibility.companyId ?? '00000000-0000-0000-0000-000000000000',
            seesCompany: visibility.seesCompanySystems,
            now: visibility.now,
          },
          type: QueryTypes.SELECT,
        },
      );
      return rows.map(stripNulls);
    },
    /** Who owns and services a system: all the access rule reads of it, without its latest reading. */
    async findOwnership(id: string): Promise<OwnedSystem | undefined> {
      const [row] = await sequelize.query<OwnedSystem>(SELECT_OWNERSHIP, {
        replacements: { id },
        type: QueryTypes.SELECT,
      });
      return row;
    },

    async findById(id: string): Promise<StoredSystem | undefined> {
      const rows = await sequelize.query<StoredSystem>(`${SELECT_SYSTEM} WHERE s.id = :id`, {
        replacements: { id },
        type: QueryTypes.SELECT,
      });
      return rows[0] && stripNulls(rows[0]);
    },
  };
}

export type SystemsRepository = ReturnType<typeof createSystemsRepository>;
