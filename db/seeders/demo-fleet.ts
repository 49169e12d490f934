import { randomBytes } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import bcrypt from 'bcryptjs';
import {
  commissioningProgress,
  commissioningResult,
  feedCommissioning,
  startCommissioning,
} from '@cellwarden/shared';
import { hashDeviceSecret } from '../../server/src/devices/device-secret';
import { toCheckResult } from '../../server/src/installer/commissioning-service';
import { createReadingsHistoryImport } from '../../server/src/telemetry/readings-history-import';
import { SCENARIOS, SCENARIO_SUMMARIES } from '../../simulator/src/scenario-catalog';
import { simulateReadings } from '../../simulator/src/simulate-readings';
import { localHour } from '../../simulator/src/local-time';
import demo from './demo-sign-ins.json';

// An invented fleet for the demo's installer company: every owner, boat, van and cabin here is fictional.

/** The fleet the simulator plays (`--fleet size` under one id prefix, scenarios dealt out in turn). */
export const DEMO_FLEET = demo.fleet as {
  idPrefix: string;
  size: number;
  scenarios: string[];
  intervalSeconds: number;
};

const OWNERS = ['Mirela Odum', 'Jonas Fairweather', 'Ayla Brenninkamp', 'Tobiah Quist', 'Sunniva Kettle'];
const NAMES = [
  ['Van “Wren”', 'van'],
  ['Narrowboat “Slow Otter”', 'boat'],
  ['Forest cabin Hollin', 'cabin'],
  ['Van “Plover”', 'van'],
  ['Sloop “Little Auk”', 'boat'],
  ['Van “Pipit”', 'van'],
  ['Bothy at Crag End', 'cabin'],
  ['Van “Dunlin”', 'van'],
  ['Ketch “Grey Seal”', 'boat'],
  ['Van “Siskin”', 'van'],
  ['Hut by Tarn Moss', 'cabin'],
  ['Van “Linnet”', 'van'],
  ['Barge “Kingfisher Row”', 'boat'],
  ['Van “Redpoll”', 'van'],
  ['Studio cabin Brackenfold', 'cabin'],
  ['Van “Twite”', 'van'],
] as const;
const SOURCE_LABELS: Record<string, string> = {
  shore: 'Shore-power charger',
  solar: 'Roof solar',
  dcdc: 'DC-DC charger',
};
const SILENT_HOURS = 5;

/**
 * The installer company's fleet: `size` systems the fleet simulator plays live, one more whose monitor went
 * quiet hours ago, and a failed commissioning check on the first thin-cable install. All monitors share
 * `secret` (fleet mode), made per installation and never written in the repository. Loaded once.
 */
export async function seedDemoFleet(sequelize: Sequelize, secret: string, now: number): Promise<boolean> {
  const q = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const firstDevice = `${DEMO_FLEET.idPrefix}-1`;
  if ((await q('SELECT 1 FROM devices WHERE id = :id', { id: firstDevice })).length > 0) return false;
  const [company] = await q<{ id: string }>(`SELECT company_id AS id FROM users WHERE email = :email`, {
    email: demo.users[1].email,
  });
  const [installer] = await q<{ id: string }>(`SELECT id FROM users WHERE email = :email`, {
    email: demo.users[1].email,
  });
  // The fleet's owners do not sign in to the demo: their password is random and thrown away.
  const unusable = await bcrypt.hash(randomBytes(24).toString('base64url'), 10);
  const ownerIds: string[] = [];
  for (const name of OWNERS) {
    const email = `${name.toLowerCase().replace(/[^a-z]+/g, '.')}@owners.example`;
    const [row] = await q<{ id: string }>(
      `INSERT INTO users (email, display_name, password_hash, roles) VALUES (:email, :name, :hash, ARRAY['owner'])
       RETURNING id`,
      { email, name, hash: unusable },
    );
    ownerIds.push(row.id);
  }
  const secretHash = hashDeviceSecret(secret);
  const systems: { systemId: string; deviceId: string; scenario: string }[] = [];
  for (let k = 0; k <= DEMO_FLEET.size; k++) {
    // The last one is not in the simulator's fleet: its monitor has been silent for hours.
    const scenario =
      k < DEMO_FLEET.size ? DEMO_FLEET.scenarios[k % DEMO_FLEET.scenarios.length] : 'phantom-drain';
    const summary = SCENARIO_SUMMARIES.find((s) => s.name === scenario)!;
    const [name, kind] = NAMES[k % NAMES.length];
    const [row] = await q<{ id: string }>(
      `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah,
         bms_continuous_discharge_a, owner_id, installer_company_id, time_zone, charge_sources)
       VALUES (:name, :kind, :chemistry, :nominalVoltage, :rated, :usable, 150, :ownerId, :companyId,
         'Europe/Amsterdam', :chargeSources::jsonb) RETURNING id`,
      {
        name,
        kind,
        chemistry: summary.chemistry,
        nominalVoltage: summary.nominalVoltage,
        rated: summary.ratedCapacityAh,
        usable: Math.min(summary.usableCapacityAh, summary.ratedCapacityAh),
        ownerId: ownerIds[k % ownerIds.length],
        companyId: company.id,
        chargeSources: JSON.stringify(
          summary.chargeSources.map((source) => ({
            id: source.id,
            kind: source.kind === 'dcdc' ? 'dc-dc' : source.kind,
            label: SOURCE_LABELS[source.kind] ?? source.id,
            ratedCurrentA: source.ratedCurrent,
          })),
        ),
      },
    );
    const deviceId = `${DEMO_FLEET.idPrefix}-${k + 1}`;
    await q(
      'INSERT INTO devices (id, system_id, secret_hash) VALUES (:id, :systemId, :secretHash) RETURNING id',
      {
        id: deviceId,
        systemId: row.id,
        secretHash,
      },
    );
    systems.push({ systemId: row.id, deviceId, scenario });
  }
  await seedSilentMonitor(sequelize, systems[systems.length - 1], now);
  const thin = systems.find((s) => s.scenario === 'thin-cable');
  if (thin) await seedFailedCheck(sequelize, thin.systemId, installer.id, now);
  return true;
}

/** The silent system's last half hour of readings, ending SILENT_HOURS ago. */
async function seedSilentMonitor(
  sequelize: Sequelize,
  system: { systemId: string; deviceId: string; scenario: string },
  now: number,
) {
  const readings = simulateReadings(SCENARIOS[system.scenario], {
    seed: 77,
    start: now - SILENT_HOURS * 3600_000 - 1800_000,
    intervalSeconds: 60,
    count: 30,
  }).readings;
  await createReadingsHistoryImport(sequelize).store(
    readings.map((reading) => ({ systemId: system.systemId, deviceId: system.deviceId, reading })),
  );
  await sequelize.query(`UPDATE devices SET last_seen_at = :at WHERE id = :id`, {
    replacements: { at: new Date(readings[readings.length - 1].measuredAt), id: system.deviceId },
  });
  // They arrived as they were measured: the node's silence check judges from the arrival of the last one.
  await sequelize.query(`UPDATE readings SET received_at = measured_at WHERE device_id = :id`, {
    replacements: { id: system.deviceId },
  });
}

/** The engine of the workshop scenarios starts on each local hour: a check started five minutes later sees it run. */
function fiveMinutesIntoAnEngineRun(around: number, longitude: number): number {
  const intoHour = localHour(around, longitude) % 1;
  return around + ((1 - intoHour) % 1) * 3_600_000 + 5 * 60_000;
}

/** A DC-DC check run two days ago on the thin-cable install, with the verdict the shared analysis gives. */
async function seedFailedCheck(sequelize: Sequelize, systemId: string, installerId: string, now: number) {
  const startedAt = fiveMinutesIntoAnEngineRun(
    now - 2 * 86400_000,
    SCENARIOS['thin-cable'].location.longitude,
  );
  const request = { sourceId: 'dcdc', ratedCurrentA: 60, windowSeconds: 300, gauge: '14', oneWayLengthM: 3 };
  let state = startCommissioning({ ...request, measureSeconds: 60 } as never);
  const readings = simulateReadings(SCENARIOS['thin-cable'], {
    seed: 5,
    start: startedAt,
    intervalSeconds: 5,
    count: 60,
  }).readings;
  for (const reading of readings) state = feedCommissioning(state, reading);
  const result = commissioningResult(state);
  const status = state.phase === 'done' && result.verdict.ok ? 'passed' : 'failed';
  await sequelize.query(
    `INSERT INTO commissioning_checks (system_id, installer_id, request, status, progress, result, started_at, finished_at)
     VALUES (:systemId, :installerId, :request::jsonb, :status, :progress::jsonb, :result::jsonb, :startedAt, :finishedAt)`,
    {
      replacements: {
        systemId,
        installerId,
        request: JSON.stringify(request),
        status,
        progress: JSON.stringify(commissioningProgress(state)),
        result: JSON.stringify(toCheckResult(result)),
        startedAt: new Date(startedAt),
        finishedAt: new Date(startedAt + 300_000),
      },
    },
  );
}
