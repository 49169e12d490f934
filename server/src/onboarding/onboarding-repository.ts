import { QueryTypes, type Sequelize } from 'sequelize';
import type { MonitorStatus, NewSystemRequest, SystemHandover } from '@cellwarden/shared';

/** An open hand-over as the service needs it. */
export interface HandoverRecord {
  id: string;
  systemId: string;
  ownerEmail: string;
  expiresAt: number;
}

const SELECT_HANDOVER = `
  SELECT h.id, h.system_id AS "systemId", s.name AS "systemName", coalesce(u.display_name, '') AS "offeredBy",
    c.name AS "companyName", (extract(epoch FROM h.created_at) * 1000)::float8 AS "createdAt",
    (extract(epoch FROM h.expires_at) * 1000)::float8 AS "expiresAt"
  FROM system_handovers h JOIN systems s ON s.id = h.system_id
  LEFT JOIN users u ON u.id = h.offered_by LEFT JOIN companies c ON c.id = s.installer_company_id`;

/** Data access for new systems, their hand-over to an owner, and a monitor's first reading. */
export function createOnboardingRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    async insertSystem(
      system: Omit<NewSystemRequest, 'ownerEmail'> & { ownerId: string; installerCompanyId: string | null },
    ): Promise<string> {
      const [row] = await select<{ id: string }>(
        `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah,
           bms_continuous_discharge_a, bms_peak_discharge_a, bms_cold_charge_cutoff, time_zone, owner_id, installer_company_id)
         VALUES (:name, :kind, :chemistry, :nominalVoltage, :ratedCapacityAh, :usableCapacityAh,
           :bmsContinuousDischargeA, :bmsPeakDischargeA, :coldChargeCutoff, :timeZone, :ownerId, :installerCompanyId)
         RETURNING id`,
        system,
      );
      return row.id;
    },

    async createHandover(handover: {
      systemId: string;
      ownerEmail: string;
      offeredBy: string;
      expiresAt: Date;
    }): Promise<void> {
      await select(
        `INSERT INTO system_handovers (system_id, owner_email, offered_by, expires_at)
         VALUES (:systemId, :ownerEmail, :offeredBy, :expiresAt) RETURNING id`,
        handover,
      );
    },

    /** Open, unexpired hand-overs made out to this address. */
    listOpenFor: (email: string, now: number) =>
      select<SystemHandover>(
        `${SELECT_HANDOVER} WHERE h.owner_email = :email AND h.accepted_at IS NULL
           AND h.expires_at > to_timestamp(:now / 1000.0) ORDER BY h.created_at`,
        { email, now },
      ),

    /**
     * Makes `userId` the owner of every system (or the one `handoverId`) handed over to `email` and not yet
     * accepted or expired, in one transaction; returns the systems that changed hands.
     */
    async accept(email: string, userId: string, now: number, handoverId?: string): Promise<string[]> {
      return sequelize.transaction(async (transaction) => {
        const rows = await sequelize.query<{ systemId: string }>(
          `UPDATE system_handovers SET accepted_at = now(), accepted_by = :userId
           WHERE owner_email = :email AND accepted_at IS NULL AND expires_at > to_timestamp(:now / 1000.0)
             AND (:handoverId::uuid IS NULL OR id = :handoverId::uuid)
           RETURNING system_id AS "systemId"`,
          {
            replacements: { email, userId, now, handoverId: handoverId ?? null },
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        const systemIds = rows.map((r) => r.systemId);
        if (systemIds.length > 0)
          await sequelize.query(
            `UPDATE systems SET owner_id = :userId, updated_at = now() WHERE id IN (:systemIds)`,
            { replacements: { userId, systemIds }, transaction },
          );
        return systemIds;
      });
    },

    /** Ends the installer company's link to a system; the company it was, or null when there was none. */
    async removeInstaller(systemId: string): Promise<string | null> {
      const [row] = await select<{ name: string | null }>(
        `UPDATE systems s SET installer_company_id = NULL, updated_at = now()
         FROM companies c WHERE s.id = :systemId AND c.id = s.installer_company_id RETURNING c.name`,
        { systemId },
      );
      return row?.name ?? null;
    },

    async latestReading(systemId: string, deviceId: string): Promise<MonitorStatus['latestReading']> {
      const [row] = await select<NonNullable<MonitorStatus['latestReading']>>(
        `SELECT (extract(epoch FROM measured_at) * 1000)::float8 AS "measuredAt", voltage, current, temperature
         FROM readings WHERE system_id = :systemId AND device_id = :deviceId ORDER BY measured_at DESC LIMIT 1`,
        { systemId, deviceId },
      );
      return row ?? null;
    },
  };
}

export type OnboardingRepository = ReturnType<typeof createOnboardingRepository>;
