import { QueryTypes, fn, type Sequelize } from 'sequelize';
import type { MonitorStatus, NewSystemRequest, SystemHandover } from '@cellwarden/shared';
import { initModels } from '../database/models';

/** An open hand-over as the service needs it. */
export interface HandoverRecord {
  id: string;
  systemId: string;
  ownerEmail: string;
  expiresAt: number;
}

// Clears a system's installer company and answers the company's name from the same statement (UPDATE … FROM
// … RETURNING), so a concurrent change cannot make the answer name another company.
const REMOVE_INSTALLER_SQL = `UPDATE systems s SET installer_company_id = NULL, updated_at = now()
  FROM companies c WHERE s.id = :systemId AND c.id = s.installer_company_id RETURNING c.name`;

// A device's newest reading, for the first-reading status. SQL: the partitioned readings table has no model.
const LATEST_READING_SQL = `SELECT (extract(epoch FROM measured_at) * 1000)::float8 AS "measuredAt", voltage, current,
    temperature
  FROM readings WHERE system_id = :systemId AND device_id = :deviceId ORDER BY measured_at DESC LIMIT 1`;

/** Data access for new systems, their hand-over to an owner, and a monitor's first reading. */
export function createOnboardingRepository(sequelize: Sequelize) {
  const { System, Handover, User, Company } = initModels(sequelize);
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    async insertSystem(
      system: Omit<NewSystemRequest, 'ownerEmail'> & { ownerId: string; installerCompanyId: string | null },
    ): Promise<string> {
      const row = await System.create(
        {
          name: system.name,
          kind: system.kind,
          chemistry: system.chemistry,
          nominalVoltage: system.nominalVoltage,
          ratedCapacityAh: system.ratedCapacityAh,
          usableCapacityAh: system.usableCapacityAh,
          bmsContinuousDischargeA: system.bmsContinuousDischargeA,
          bmsPeakDischargeA: system.bmsPeakDischargeA,
          bmsColdChargeCutoff: system.coldChargeCutoff,
          timeZone: system.timeZone,
          ownerId: system.ownerId,
          installerCompanyId: system.installerCompanyId,
        },
        { returning: ['id'] },
      );
      return row.id;
    },

    async createHandover(handover: {
      systemId: string;
      ownerEmail: string;
      offeredBy: string;
      expiresAt: Date;
    }): Promise<void> {
      await Handover.create(handover, { returning: false });
    },

    /** Open, unexpired hand-overs made out to this address. */
    async listOpenFor(email: string, now: number): Promise<SystemHandover[]> {
      const rows = await Handover.scope({ method: ['active', now] }).findAll({
        where: { ownerEmail: email },
        include: [
          {
            model: System,
            as: 'system',
            attributes: ['name'],
            required: true,
            include: [{ model: Company, as: 'installerCompany', attributes: ['name'] }],
          },
          { model: User, as: 'offerer', attributes: ['displayName'] },
        ],
        order: [['createdAt', 'ASC']],
      });
      return rows.map((row) => ({
        id: row.id,
        systemId: row.systemId,
        systemName: row.system!.name,
        offeredBy: row.offerer?.displayName ?? '',
        companyName: row.system!.installerCompany?.name ?? null,
        createdAt: row.createdAt.getTime(),
        expiresAt: row.expiresAt.getTime(),
      }));
    },

    /**
     * Makes `userId` the owner of every system (or the one `handoverId`) handed over to `email` and not yet
     * accepted or expired, in one transaction; returns the systems that changed hands.
     */
    async accept(email: string, userId: string, now: number, handoverId?: string): Promise<string[]> {
      return sequelize.transaction(async (transaction) => {
        const [, rows] = await Handover.scope({ method: ['active', now] }).update(
          { acceptedAt: fn('now'), acceptedBy: userId },
          {
            where: handoverId === undefined ? { ownerEmail: email } : { ownerEmail: email, id: handoverId },
            returning: true,
            transaction,
          },
        );
        const systemIds = rows.map((r) => r.systemId);
        // updated_at becomes the database's now() (the model's default), as before.
        if (systemIds.length > 0)
          await System.update({ ownerId: userId }, { where: { id: systemIds }, transaction });
        return systemIds;
      });
    },

    /** Ends the installer company's link to a system; the company it was, or null when there was none. */
    async removeInstaller(systemId: string): Promise<string | null> {
      const [row] = await select<{ name: string | null }>(REMOVE_INSTALLER_SQL, { systemId });
      return row?.name ?? null;
    },

    async latestReading(systemId: string, deviceId: string): Promise<MonitorStatus['latestReading']> {
      const [row] = await select<NonNullable<MonitorStatus['latestReading']>>(LATEST_READING_SQL, {
        systemId,
        deviceId,
      });
      return row ?? null;
    },
  };
}

export type OnboardingRepository = ReturnType<typeof createOnboardingRepository>;
