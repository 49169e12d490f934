import { QueryTypes, type Sequelize } from 'sequelize';
import type { DeviceListing, MonitorLatest } from '@cellwarden/shared';

/** A battery monitor's credentials, as stored (the secret only as a hash). */
export interface DeviceRecord {
  id: string;
  systemId: string;
  secretHash: string;
  revokedAt: Date | null;
}

const SELECT_LISTING = `SELECT id, label, (extract(epoch FROM created_at) * 1000)::float8 AS "createdAt",
  (extract(epoch FROM last_seen_at) * 1000)::float8 AS "lastSeenAt",
  (extract(epoch FROM revoked_at) * 1000)::float8 AS "revokedAt" FROM devices`;

/** Data access for devices. */
export function createDevicesRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    async findById(id: string): Promise<DeviceRecord | undefined> {
      const rows = await select<DeviceRecord>(
        `SELECT id, system_id AS "systemId", secret_hash AS "secretHash", revoked_at AS "revokedAt" FROM devices WHERE id = :id`,
        { id },
      );
      return rows[0];
    },
    listForSystem: (systemId: string) =>
      select<DeviceListing>(`${SELECT_LISTING} WHERE system_id = :systemId ORDER BY created_at`, {
        systemId,
      }),
    async findListing(systemId: string, id: string): Promise<DeviceListing | undefined> {
      return (
        await select<DeviceListing>(`${SELECT_LISTING} WHERE system_id = :systemId AND id = :id`, {
          systemId,
          id,
        })
      )[0];
    },
    /** Adds a device; false when the id is taken (by any system). */
    async insert(device: {
      id: string;
      systemId: string;
      label: string;
      secretHash: string;
    }): Promise<boolean> {
      const rows = await select(
        `INSERT INTO devices (id, system_id, label, secret_hash) VALUES (:id, :systemId, :label, :secretHash)
         ON CONFLICT (id) DO NOTHING RETURNING id`,
        device,
      );
      return rows.length > 0;
    },
    async setSecret(systemId: string, id: string, secretHash: string): Promise<boolean> {
      const rows = await select(
        `UPDATE devices SET secret_hash = :secretHash, updated_at = now()
         WHERE system_id = :systemId AND id = :id AND revoked_at IS NULL RETURNING id`,
        { systemId, id, secretHash },
      );
      return rows.length > 0;
    },
    async revoke(systemId: string, id: string): Promise<boolean> {
      const rows = await select(
        `UPDATE devices SET revoked_at = now(), updated_at = now()
         WHERE system_id = :systemId AND id = :id AND revoked_at IS NULL RETURNING id`,
        { systemId, id },
      );
      return rows.length > 0;
    },
    /** Every monitor in service on a system with its newest reading, lead monitor first (see lead-monitor.ts). */
    async monitorsWithLatest(systemId: string): Promise<MonitorLatest[]> {
      const rows = await select<{ deviceId: string; label: string; reading: MonitorLatest['reading'] }>(
        `SELECT d.id AS "deviceId", d.label,
           CASE WHEN r.measured_at IS NULL THEN NULL ELSE json_build_object(
             'measuredAt', (extract(epoch FROM r.measured_at) * 1000)::bigint,
             'receivedAt', (extract(epoch FROM r.received_at) * 1000)::bigint,
             'voltage', r.voltage, 'current', r.current, 'temperature', r.temperature,
             'stateOfCharge', r.state_of_charge, 'power', r.power, 'sourceCurrents', r.source_currents,
             'deviceId', r.device_id) END AS reading
         FROM devices d
         LEFT JOIN LATERAL (SELECT * FROM readings WHERE system_id = d.system_id AND device_id = d.id
           ORDER BY measured_at DESC LIMIT 1) r ON true
         WHERE d.system_id = :systemId AND d.revoked_at IS NULL
         ORDER BY d.created_at, d.id`,
        { systemId },
      );
      return rows.map((row, index) => ({ ...row, lead: index === 0, reading: withoutNulls(row.reading) }));
    },
    /** Notes when devices last reported; one statement per ingest batch. */
    async markSeen(lastSeen: Map<string, number>): Promise<void> {
      if (lastSeen.size === 0) return;
      await sequelize.query(
        `UPDATE devices d SET last_seen_at = GREATEST(coalesce(d.last_seen_at, to_timestamp(0)), to_timestamp(v.at / 1000.0))
         FROM (SELECT unnest(ARRAY[:ids]::text[]) AS id, unnest(ARRAY[:ats]::float8[]) AS at) v WHERE d.id = v.id`,
        { replacements: { ids: [...lastSeen.keys()], ats: [...lastSeen.values()] } },
      );
    },
  };
}

export type DevicesRepository = ReturnType<typeof createDevicesRepository>;

function withoutNulls(reading: MonitorLatest['reading']): MonitorLatest['reading'] {
  if (reading)
    for (const [key, value] of Object.entries(reading)) if (value === null) delete (reading as never)[key];
  return reading;
}
