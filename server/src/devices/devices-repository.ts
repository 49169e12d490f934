import { QueryTypes, type Sequelize } from 'sequelize';

/** A battery monitor's credentials, as stored (the secret only as a hash). */
export interface DeviceRecord {
  id: string;
  systemId: string;
  secretHash: string;
  revokedAt: Date | null;
}

/** Data access for devices. */
export function createDevicesRepository(sequelize: Sequelize) {
  return {
    async findById(id: string): Promise<DeviceRecord | undefined> {
      const rows = await sequelize.query<DeviceRecord>(
        `SELECT id, system_id AS "systemId", secret_hash AS "secretHash", revoked_at AS "revokedAt" FROM devices WHERE id = :id`,
        { replacements: { id }, type: QueryTypes.SELECT },
      );
      return rows[0];
    },
  };
}

export type DevicesRepository = ReturnType<typeof createDevicesRepository>;
