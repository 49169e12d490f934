import { connectDatabase } from '../server/src/database/connect-database';
import { migrateToLatest } from './migrator';
import { seedDemoScenario } from './seeders/demo-scenario';

// `tsx db/prepare-database.ts <url> [--seed]`: migrations, then (optionally) the demo scenario.
async function prepare() {
  const [url, ...flags] = process.argv.slice(2);
  if (!url) throw new Error('usage: prepare-database <database-url> [--seed]');
  const sequelize = connectDatabase(url);
  try {
    const applied = await migrateToLatest(sequelize);
    if (applied.length > 0) console.log(`Applied migrations: ${applied.join(', ')}`);
    if (flags.includes('--seed') && (await seedDemoScenario(sequelize)))
      console.log('Loaded the demo scenario.');
  } finally {
    await sequelize.close();
  }
}

prepare().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
