import { QueryTypes, type ModelStatic, type Model } from 'sequelize';
import { connectDatabase } from '../../server/src/database/connect-database';
import { initModels } from '../../server/src/database/models';
import { createTestDatabase } from '../support/test-database';

// Entity tables with a class model (DEVELOPERS.md, "Models, raw SQL and boundaries").
const MODELLED_TABLES = [
  'companies',
  'users',
  'sign_in_sessions',
  'refresh_tokens',
  'invitations',
  'password_resets',
  'audit_entries',
  'user_preferences',
  'systems',
  'grants',
  'devices',
  'alert_events',
  'alert_notices',
  'commissioning_checks',
  'uploads',
  'energy_budgets',
  'access_share_codes',
  'access_requests',
  'system_handovers',
  'battery_capacity_samples',
  'battery_health_checkpoints',
];

// The schema comes only from the migrations; the models describe it. This holds the two together: every
// model attribute is a column of its table, and a NOT NULL column without a default is one the model declares.
describe('models against the migrated schema', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let sequelize: ReturnType<typeof connectDatabase>;
  beforeAll(async () => {
    database = await createTestDatabase();
    sequelize = connectDatabase(database.url);
  });
  afterAll(async () => {
    await sequelize.close();
    await database.drop();
  });

  it('match their tables column for column', async () => {
    const columns = await sequelize.query<{
      table: string;
      column: string;
      nullable: string;
      hasDefault: boolean;
    }>(
      `SELECT table_name AS "table", column_name AS "column", is_nullable AS nullable,
         column_default IS NOT NULL AS "hasDefault"
       FROM information_schema.columns WHERE table_schema = 'public'`,
      { type: QueryTypes.SELECT },
    );
    // A union of model classes has no common `getAttributes`; each is a ModelStatic of some Model.
    const models = Object.values(initModels(sequelize)) as unknown as ModelStatic<Model>[];
    expect(models.length).toBeGreaterThanOrEqual(8);
    // Every entity table that has been given a model is checked below; a model dropped from initModels fails here.
    const tables = models.map((model) => String(model.getTableName()));
    expect(tables).toEqual(expect.arrayContaining(MODELLED_TABLES));
    for (const model of models) {
      const table = String(model.getTableName());
      const inTable = columns.filter((c) => c.table === table);
      expect({ table, found: inTable.length > 0 }).toEqual({ table, found: true });
      const fields = Object.values(model.getAttributes()).map((a) => a.field ?? '');
      const missing = fields.filter((field) => !inTable.some((c) => c.column === field));
      expect({ table, missing }).toEqual({ table, missing: [] });
      const required = inTable.filter((c) => c.nullable === 'NO' && !c.hasDefault).map((c) => c.column);
      const undeclared = required.filter((column) => !fields.includes(column));
      expect({ table, undeclared }).toEqual({ table, undeclared: [] });
    }
  });
});
