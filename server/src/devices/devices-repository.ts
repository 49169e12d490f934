import { QueryTypes, UniqueConstraintError, fn, type Sequelize } from 'sequelize';
import type { DeviceListing, MonitorLatest } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { Device } from './device-model';

/** A battery monitor's credentials, as stored (the secret only as a hash). */
export interface DeviceRecord {
  id: string;
  systemId: string;
  secretHash: string;
  revokedAt: Date | null;
}

// Each monitor in service with its newest reading. SQL because the readings table is partitioned and has no
// model, and a LATERAL join is what takes one row per monitor from its index in one statement.
const MONITORS_WITH_LATEST_SQL = `SELECT d.id AS "deviceId", d.label,
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
  ORDER BY d.created_at, d.id`;

// `last_seen_at` of every device in an ingest batch in one UPDATE (unnest of ids and times), never moving back.
// SQL because a model's update sets one value for all the rows it matches.
const MARK_SEEN_SQL = `UPDATE devices d
  SET last_seen_at = GREATEST(coalesce(d.last_seen_at, to_timestamp(0)), to_timestamp(v.at / 1000.0))
  FROM (SELECT unnest(ARRAY[:ids]::text[]) AS id, unnest(ARRAY[:ats]::float8[]) AS at) v WHERE d.id = v.id`;

const LISTING_ATTRIBUTES = ['id', 'label', 'createdAt', 'lastSeenAt', 'revokedAt'] as const;

const toListing = (row: Pick<Device, (typeof LISTING_ATTRIBUTES)[number]>): DeviceListing => ({
  id: row.id,
  label: row.label,
  createdAt: row.createdAt.getTime(),
  lastSeenAt: row.lastSeenAt?.getTime() ?? null,
  revokedAt: row.revokedAt?.getTime() ?? null,
});

/** Data access for devices. */
export function createDevicesRepository(sequelize: Sequelize) {
  const { Device } = initModels(sequelize);
  return {
    async findById(id: string): Promise<DeviceRecord | undefined> {
      const row = await Device.findByPk(id, {
        attributes: ['id', 'systemId', 'secretHash', 'revokedAt'],
        raw: true,
      });
      return row
        ? { id: row.id, systemId: row.systemId, secretHash: row.secretHash, revokedAt: row.revokedAt ?? null }
        : undefined;
    },
    async listForSystem(systemId: string): Promise<DeviceListing[]> {
      const rows = await Device.findAll({
        where: { systemId },
        attributes: [...LISTING_ATTRIBUTES],
        order: [['createdAt', 'ASC']],
        raw: true,
      });
      return rows.map(toListing);
    },
    async findListing(systemId: string, id: string): Promise<DeviceListing | undefined> {
      const row = await Device.findOne({
        where: { systemId, id },
        attributes: [...LISTING_ATTRIBUTES],
        raw: true,
      });
      return row ? toListing(row) : undefined;
    },
    /** Adds a device; false when the id is taken (by any system). */
    async insert(device: {
      id: string;
      systemId: string;
      label: string;
      secretHash: string;
    }): Promise<boolean> {
      try {
        await Device.create(device, { returning: false });
        return true;
      } catch (error) {
        // The id is the only unique key of the table: a clash means another monitor has it.
        if (error instanceof UniqueConstraintError) return false;
        throw error;
      }
    },
    async setSecret(systemId: string, id: string, secretHash: string): Promise<boolean> {
      const [count] = await Device.scope('active').update({ secretHash }, { where: { systemId, id } });
      return count > 0;
    },
    async revoke(systemId: string, id: string): Promise<boolean> {
      const [count] = await Device.scope('active').update(
        { revokedAt: fn('now') },
        { where: { systemId, id } },
      );
      return count > 0;
    },
    /** Every monitor in service on a system with its newest reading, lead monitor first (see lead-monitor.ts). */
    async monitorsWithLatest(systemId: string): Promise<MonitorLatest[]> {
      const rows = await sequelize.query<{
        deviceId: string;
        label: string;
        reading: MonitorLatest['reading'];
      }>(MONITORS_WITH_LATEST_SQL, { replacements: { systemId }, type: QueryTypes.SELECT });
      return rows.map((row, index) => ({ ...row, lead: index === 0, reading: withoutNulls(row.reading) }));
    },
    /** Notes when devices last reported; one statement per ingest batch. */
    async markSeen(lastSeen: Map<string, number>): Promise<void> {
      if (lastSeen.size === 0) return;
      await sequelize.query(MARK_SEEN_SQL, {
        replacements: { ids: [...lastSeen.keys()], ats: [...lastSeen.values()] },
      });
    },
  };
}

export type DevicesRepository = ReturnType<typeof createDevicesRepository>;

function withoutNulls(reading: MonitorLatest['reading']): MonitorLatest['reading'] {
  if (reading)
    for (const [key, value] of Object.entries(reading)) if (value === null) delete (reading as never)[key];
  return reading;
}
