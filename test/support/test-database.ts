import { randomBytes } from 'node:crypto';
import { Client } from 'pg';

/** A database of its own for one test file, cloned from the migrated template `npm test` prepared. */
export async function createTestDatabase(): Promise<{ url: string; drop(): Promise<void> }> {
  const base = process.env.CW_TEST_DATABASE_BASE_URL;
  const template = process.env.CW_TEST_TEMPLATE_DATABASE;
  if (!base || !template)
    throw new Error('Run integration tests through `npm test`, which prepares PostgreSQL');
  const name = `cw_test_${randomBytes(6).toString('hex')}`;
  const admin = new Client({ connectionString: `${base}/postgres` });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE ${name} TEMPLATE ${template}`);
  } finally {
    await admin.end();
  }
  return {
    url: `${base}/${name}`,
    async drop() {
      const client = new Client({ connectionString: `${base}/postgres` });
      await client.connect();
      try {
        await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      } finally {
        await client.end();
      }
    },
  };
}
