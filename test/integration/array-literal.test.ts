import { QueryTypes } from 'sequelize';
import { connectDatabase } from '../../server/src/database/connect-database';
import { arrayLiteral } from '../../server/src/database/sql-values';
import { createTestDatabase } from '../support/test-database';

// The readings insert binds its columns as array literals it builds itself; PostgreSQL's own array input must
// read them back element for element, whatever a device id or a source-currents document holds.
describe('array literals read back by PostgreSQL', () => {
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

  const roundTrip = async <T>(type: string, values: readonly (string | number | null)[]) => {
    const [row] = await sequelize.query<{ back: T[] }>(`SELECT $1::${type}[] AS back`, {
      bind: [arrayLiteral(values)],
      type: QueryTypes.SELECT,
    });
    return row.back;
  };

  it('keeps text with quotes, backslashes, commas, braces, spaces and the word NULL', async () => {
    const texts = ['plain', 'with "quotes"', 'back\\slash', 'a,b', '{braces}', ' spaced ', 'NULL', '', null];
    expect(await roundTrip<string | null>('text', texts)).toEqual(texts);
  });

  it('keeps float8 values exactly, and NULL', async () => {
    const numbers = [13.1, -4.5, 0, 1e-7, 0.1 + 0.2, -273.15, null];
    expect(await roundTrip<number | null>('float8', numbers)).toEqual(numbers);
  });

  it('reads ISO times as the same instants, to the millisecond', async () => {
    const instants = [Date.UTC(2026, 11, 3, 19, 4, 5, 678), Date.UTC(2024, 1, 29, 0, 0, 0, 1)];
    const back = await roundTrip<Date>(
      'timestamptz',
      instants.map((ms) => new Date(ms).toISOString()),
    );
    expect(back.map((d) => new Date(d).getTime())).toEqual(instants);
  });

  it('reads JSON documents in a text array as the same documents', async () => {
    const documents = [JSON.stringify({ 'dc-dc': 42.5, 'solar "roof"': 3 }), null];
    const [row] = await sequelize.query<{ back: unknown[] }>(
      'SELECT array(SELECT d::jsonb FROM unnest($1::text[]) AS t(d)) AS back',
      { bind: [arrayLiteral(documents)], type: QueryTypes.SELECT },
    );
    expect(row.back).toEqual([{ 'dc-dc': 42.5, 'solar "roof"': 3 }, null]);
  });
});
