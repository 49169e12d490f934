import { writeFileSync } from 'node:fs';
import { connectDatabase } from '../server/src/database/connect-database';
import { migrateToLatest } from './migrator';
import { createBatteryHealthJob } from '../server/src/battery-health/battery-health-job';
import { createBatteryHealthRepository } from '../server/src/battery-health/battery-health-repository';
import { seedDemoBatteryYear } from './seeders/demo-battery-year';
import { seedDemoFleet } from './seeders/demo-fleet';
import { seedDemoHistory } from './seeders/demo-history';
import { seedDemoScenario } from './seeders/demo-scenario';

/** How often the demo's live simulators report, s; the seeded history is simulated at the same step. */
const DEMO_LIVE_INTERVAL_SECONDS = 5;

// `tsx db/prepare-database.ts <url> [--seed [--history-days N] [--timeline-file PATH]]`: migrations, then
// (optionally) the demo scenario and a few days of its history, whose timeline the live simulators resume.
async function prepare() {
  const [url, ...flags] = process.argv.slice(2);
  if (!url) throw new Error('usage: prepare-database <database-url> [--seed]');
  const sequelize = connectDatabase(url);
  try {
    const applied = await migrateToLatest(sequelize);
    if (applied.length > 0) console.log(`Applied migrations: ${applied.join(', ')}`);
    if (flags.includes('--seed') && (await seedDemoScenario(sequelize)))
      console.log('Loaded the demo scenario.');
    // The fleet's shared monitor secret comes from the environment (npm start makes it), never from a file here.
    const fleetSecret = process.env.CW_DEMO_FLEET_SECRET;
    if (flags.includes('--seed') && fleetSecret && (await seedDemoFleet(sequelize, fleetSecret, Date.now())))
      console.log("Loaded the installer company's demo fleet.");
    const days = flags.includes('--history-days') ? Number(flags[flags.indexOf('--history-days') + 1]) : 0;
    if (flags.includes('--seed') && days > 0) {
      const { stored, timeline } = await seedDemoHistory(sequelize, {
        days,
        liveIntervalSeconds: DEMO_LIVE_INTERVAL_SECONDS,
        storedEverySeconds: 60,
        now: Date.now(),
        log: console.log,
      });
      if (stored > 0) console.log(`Stored ${stored} demo readings of the past ${days} days.`);
      // A year of the van's battery life before that week, through the rollups only; then the health job
      // takes in the week, so the battery health screen is ready when the server starts.
      if (timeline) await seedDemoBatteryYear(sequelize, { end: timeline.origin, log: console.log });
      const health = createBatteryHealthJob({
        repository: createBatteryHealthRepository(sequelize),
        logger: { warn: (message: string, fields?: object) => console.warn(message, fields ?? '') },
      });
      await health.catchUp();
      const timelineFile = flags.includes('--timeline-file')
        ? flags[flags.indexOf('--timeline-file') + 1]
        : undefined;
      if (timeline && timelineFile) writeFileSync(timelineFile, `${JSON.stringify(timeline, null, 2)}\n`);
    }
  } finally {
    await sequelize.close();
  }
}

prepare().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
