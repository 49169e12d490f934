import { runMigrationCli } from './migration-cli';

// The paths that never reach a database; up/down/pending against PostgreSQL are in
// test/integration/migration-cli.test.ts.
describe('runMigrationCli', () => {
  const run = async (args: string[], env: Record<string, string | undefined> = {}) => {
    const lines: string[] = [];
    const connect = jest.fn();
    const code = await runMigrationCli(args, { env, print: (line) => lines.push(line), connect });
    return { code, output: lines.join('\n'), connected: connect.mock.calls.length > 0 };
  };

  it('prints the usage and exits 2 without a command', async () => {
    const { code, output, connected } = await run([]);
    expect(code).toBe(2);
    expect(output).toMatch(/usage: npm run db -- <command>/);
    expect(connected).toBe(false);
  });

  it('names an unknown command and exits 2', async () => {
    const { code, output } = await run(['sideways'], { DATABASE_URL: 'postgres://h/db' });
    expect(code).toBe(2);
    expect(output).toMatch(/unknown arguments: sideways/);
  });

  it('refuses extra arguments rather than ignoring them', async () => {
    const { code, output } = await run(['down', '3'], { DATABASE_URL: 'postgres://h/db' });
    expect(code).toBe(2);
    expect(output).toMatch(/unknown arguments: down 3/);
  });

  it('says DATABASE_URL is required, as the server does, and connects to nothing', async () => {
    const { code, output, connected } = await run(['pending'], {});
    expect(code).toBe(2);
    expect(output).toMatch(/DATABASE_URL: is required: the PostgreSQL URL/);
    expect(connected).toBe(false);
  });

  it('refuses a DATABASE_URL that is not a URL', async () => {
    const { code, output } = await run(['up'], { DATABASE_URL: 'cellwarden' });
    expect(code).toBe(2);
    expect(output).toMatch(/DATABASE_URL/);
  });
});
