import { runMigrationCli } from './migration-cli';

// The bin behind `npm run db -- up|down|pending`; everything else is in migration-cli.ts.
runMigrationCli(process.argv.slice(2), { env: process.env, print: console.log }).then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
