import { QueryTypes, type Sequelize } from 'sequelize';
import bcrypt from 'bcryptjs';
import { SCENARIO_SUMMARIES } from '../../simulator/src/scenario-catalog';
import demo from './demo-sign-ins.json';
import { hashDeviceSecret } from '../../server/src/devices/device-secret';
import { seedDemoInstallRegister } from './demo-install-register';

// An invented scenario: every person, company and place here is fictional.

// Sign-ins and device secrets live in JSON so the start script (plain Node) can print and use them.
/** Password of every demo account (development only). */
export const DEMO_PASSWORD: string = demo.password;
/** The demo sign-ins, printed by `npm start`. */
export const DEMO_USERS = demo.users;
/** Demo battery monitors with their MQTT secrets, which the simulator uses. */
export const DEMO_DEVICES = demo.devices as {
  id: string;
  secret: string;
  system: 'van' | 'cabin';
  scenario: string;
  label?: string;
  /** A second monitor on the bank of this device: it joins that system instead of making its own. */
  monitorOf?: string;
  /** The second monitor's own calibration seed (simulator --monitor-seed). */
  monitorSeed?: number;
}[];

const COMPANY_NAME = 'Kestrel Hollow Vanfitters';
// Each demo system is the battery its monitor's simulator scenario models, so history, live readings and
// settings agree.
const scenarioOf = (name: string) => SCENARIO_SUMMARIES.find((s) => s.name === name)!;
const SYSTEMS = {
  van: {
    name: 'Winter van “Moth”',
    kind: 'van',
    scenario: scenarioOf('frost-night'),
    timeZone: 'Europe/Helsinki',
  },
  cabin: {
    name: 'Lakeside cabin',
    kind: 'cabin',
    scenario: scenarioOf('flat-by-morning'),
    timeZone: 'Europe/Oslo',
  },
} as const;

/** The systems the demo creates, keyed as in demo-sign-ins.json. */
export const DEMO_SYSTEMS = SYSTEMS;

const SOURCE_LABELS: Record<string, string> = {
  shore: 'Shore-power charger',
  solar: 'Roof solar',
  'dc-dc': 'DC-DC charger',
};

/** Loads the demo scenario once; a second run finds it and changes nothing. */
export async function seedDemoScenario(sequelize: Sequelize): Promise<boolean> {
  const existing = await sequelize.query('SELECT 1 FROM users WHERE email = :email', {
    replacements: { email: DEMO_USERS[0].email },
    type: QueryTypes.SELECT,
  });
  if (existing.length > 0) return false;
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await sequelize.transaction(async (transaction) => {
    const q = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
      sequelize.query<T>(sql, { replacements, transaction, type: QueryTypes.SELECT });
    const [company] = await q<{ id: string }>('INSERT INTO companies (name) VALUES (:name) RETURNING id', {
      name: COMPANY_NAME,
    });
    const userIds: Record<string, string> = {};
    for (const user of DEMO_USERS) {
      const [row] = await q<{ id: string }>(
        `INSERT INTO users (email, display_name, password_hash, roles, company_id)
         VALUES (:email, :displayName, :passwordHash, ARRAY[:roles]::text[], :companyId) RETURNING id`,
        { ...user, roles: user.roles, passwordHash, companyId: user.company ? company.id : null },
      );
      userIds[user.email] = row.id;
    }
    const systemIds: Record<string, string> = {};
    for (const device of DEMO_DEVICES) {
      if (device.monitorOf) continue;
      const { name, kind, scenario, timeZone } = SYSTEMS[device.system];
      const [row] = await q<{ id: string }>(
        `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah,
           bms_continuous_discharge_a, owner_id, installer_company_id, time_zone, charge_sources)
         VALUES (:name, :kind, :chemistry, :nominalVoltage, :rated, :usable, :bms, :ownerId, :companyId, :timeZone,
           :chargeSources::jsonb) RETURNING id`,
        {
          name,
          kind,
          timeZone,
          chemistry: scenario.chemistry,
          nominalVoltage: scenario.nominalVoltage,
          rated: scenario.ratedCapacityAh,
          usable: Math.min(scenario.usableCapacityAh, scenario.ratedCapacityAh),
          bms: 150,
          ownerId: userIds[DEMO_USERS[0].email],
          companyId: company.id,
          chargeSources: JSON.stringify(
            scenario.chargeSources.map((source) => ({
              id: source.id,
              kind: source.kind === 'dcdc' ? 'dc-dc' : source.kind,
              label: SOURCE_LABELS[source.kind] ?? source.id,
              ratedCurrentA: source.ratedCurrent,
            })),
          ),
        },
      );
      systemIds[device.system] = row.id;
    }
    // The cabin's bank carries two monitors: its shunt (the lead, registered first) and the pack BMS's own link,
    // registered a minute later; the live view shows both, labelled.
    for (const [order, device] of DEMO_DEVICES.entries())
      await q(
        `INSERT INTO devices (id, system_id, secret_hash, label, created_at)
         VALUES (:id, :systemId, :secretHash, :label, now() - make_interval(mins => 10 - :order)) RETURNING id`,
        {
          id: device.id,
          systemId: systemIds[device.system],
          secretHash: hashDeviceSecret(device.secret),
          label: device.label ?? 'battery monitor',
          order,
        },
      );
    await seedDemoInstallRegister(sequelize, systemIds.van, transaction);
    // The owner lets the fitters' support desk look at the van (not the cabin) for a month.
    await q(
      `INSERT INTO grants (system_id, grantee_company_id, access, granted_by, expires_at)
       VALUES (:systemId, :companyId, 'view', :ownerId, now() + interval '30 days') RETURNING id`,
      { systemId: systemIds.van, companyId: company.id, ownerId: userIds[DEMO_USERS[0].email] },
    );
  });
  return true;
}
