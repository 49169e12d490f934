import { connectDatabase } from '../server/src/database/connect-database';
import { migrateToLatest } from './migrator';
import { seedDemoHistory } from './seeders/demo-history';
import { seedDemoScenario } from './seeders/demo-scenario';

// `tsx db/prepare-database.ts <url> [--seed [--history-days N]]`: migrations, then (optionally) the demo
// scenario and a few days of its history.
async function prepare() {
  const [url, ...flags] = process.argv.slice(2);
  if (!url) throw new Error('usage: prepare-database <database-url> [--seed]');
  const sequelize = connectDatabase(url);
  try {
    const applied = await migrateToLatest(sequelize);
    if (applied.length > 0) console.log(`Applied migrations: ${applied.join(', ')}`);
    if (flags.includes('--seed') && (await seedDemoScenario(sequelize)))
      console.log('Loaded the demo scenario.');
    const days = flags.includes('--history-days') ? Number(flags[flags.indexOf('--history-days') + 1]) : 0;
    if (flags.includes('--seed') && days > 0) {
      const stored = await seedDemoHistory(sequelize, {
        days,
        intervalSeconds: 60,
        now: Date.now(),
        log: console.log,
      });
      if (stored > 0) console.log(`Stored ${stored} demo readings of the past ${days} days.`);
    }
  } finally {
    await sequelize.close();
  }
}

prepare().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
