import { readdirSync } from 'node:fs';
import { migrations } from './index';
import type { Migration } from './migration';

// umzug records each step by its `name` in schema_migrations, so a name that drifts from its file (a copied
// file, a renamed one) would run a step twice or never; the index decides the order they run in.
const files = readdirSync(__dirname)
  .filter((file) => /^\d{4}\.\d{2}\.\d{2}T\d{2}\.\d{2}\.\d{2}\.[a-z0-9-]+\.ts$/.test(file))
  .map((file) => file.replace(/\.ts$/, ''))
  .sort();

const isMigration = (value: unknown): value is Migration =>
  typeof value === 'object' && value !== null && 'name' in value && 'up' in value && 'down' in value;

describe('migrations', () => {
  it('are named after their files, one migration per file', () => {
    for (const file of files) {
      // eslint-disable-next-line @typescript-eslint/no-require-imports
      const exported = Object.values(require(`./${file}`) as Record<string, unknown>).filter(isMigration);
      expect(exported.map((m) => m.name)).toEqual([file]);
    }
  });

  it('are all listed in the index, in the order of their timestamps', () => {
    expect(migrations.map((m) => m.name)).toEqual(files);
  });

  it('have timestamped names of a verb and a table', () => {
    for (const name of files)
      expect(name).toMatch(/^\d{4}\.\d{2}\.\d{2}T\d{2}\.\d{2}\.\d{2}\.[a-z]+-[a-z0-9-]+$/);
  });
});
