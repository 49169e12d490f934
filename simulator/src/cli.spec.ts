import { CliArgumentError, parseCli, USAGE } from './cli';
import { SCENARIO_NAMES } from './scenario-catalog';
import { monitorExample } from '@cellwarden/shared';

const device = ['--device', 'cw-van:secret'];

function argumentOf(argv: string[]): string | undefined {
  try {
    parseCli(argv);
  } catch (error) {
    return error instanceof CliArgumentError ? error.argument : (error as { code?: string }).code;
  }
  return undefined;
}

describe('command line', () => {
  it('lists every option and every scenario in its usage', () => {
    for (const flag of [
      '--broker',
      '--device',
      '--fleet',
      '--scenario',
      '--seed',
      '--interval',
      '--count',
      '--speed',
      '--start',
      '--offline-every',
      '--offline-for',
      '--list-scenarios',
      '--help',
    ]) {
      expect(USAGE).toContain(flag);
    }
    for (const name of SCENARIO_NAMES) expect(USAGE).toContain(name);
  });

  it('parses a full command line', () => {
    const options = parseCli([
      ...device,
      '--scenario',
      'thin-cable',
      '--seed',
      '4',
      '--speed',
      '60',
      '--interval',
      '5',
      '--count',
      '12',
      '--start',
      '2026-01-10T18:00:00Z',
      '--offline-every',
      '30',
      '--offline-for',
      '5',
    ]);
    expect(options).toMatchObject({
      devices: [{ id: 'cw-van', secret: 'secret' }],
      scenarios: ['thin-cable'],
      seed: 4,
      speed: 60,
      interval: 5,
      count: 12,
      start: Date.UTC(2026, 0, 10, 18),
      offline: { everyMinutes: 30, forMinutes: 5 },
    });
  });

  it('defaults to frost-night alone, and to every scenario for a fleet', () => {
    expect(parseCli(device).scenarios).toEqual(['frost-night']);
    expect(parseCli([...device, '--fleet', '4']).scenarios).toEqual(SCENARIO_NAMES);
  });

  it.each([
    [['--seed', 'x'], 'seed'],
    [['--seed', '1.5'], 'seed'],
    [['--speed', '0'], 'speed'],
    [['--interval=-1'], 'interval'],
    [['--count', '0'], 'count'],
    [['--fleet', 'many'], 'fleet'],
    [['--start', 'yesterday'], 'start'],
    [['--scenario', 'moon-base'], 'scenario'],
    [['--offline-every', '30'], 'offline-for'],
    [['--offline-every', '10', '--offline-for', '10'], 'offline-for'],
  ])('names the bad argument in %j', (args, argument) => {
    expect(argumentOf([...device, ...args])).toBe(argument);
  });

  it('requires a device, a well-formed one, and exactly one to name a fleet', () => {
    expect(argumentOf([])).toBe('device');
    expect(argumentOf(['--device', 'no-secret'])).toBe('device');
    expect(argumentOf([...device, '--device', 'b:c', '--fleet', '2'])).toBe('fleet');
    expect(parseCli(['--help']).help).toBe(true);
  });

  it('resumes only a timeline with a known start', () => {
    expect(argumentOf([...device, '--resume'])).toBe('resume');
    expect(parseCli([...device, '--resume', '--start', '2026-12-01T00:00:00Z']).resume).toBe(true);
  });

  it('refuses an unknown option by name', () => {
    expect(() => parseCli([...device, '--turbo'])).toThrow(/--turbo/);
  });

  it('accepts the simulator command shown with a new monitor, as the shell would split it', () => {
    const { simulatorCommand } = monitorExample({
      brokerUrl: 'mqtt://127.0.0.1:1883',
      deviceId: 'cabin-shunt-2',
      password: "it's-secret",
    });
    // POSIX sh: single-quoted words lose their quotes; '\'' is an escaped quote between two quoted parts.
    const words = simulatorCommand
      .replace(/^npm run simulate -- /, '')
      .match(/(?:'[^']*'|\\'|[^\s'])+/g)!
      .map((word) => word.replace(/'\\''/g, "'").replace(/^'|'$/g, '').replace(/\\'/g, "'"));
    const options = parseCli(words);
    expect(options.devices).toEqual([{ id: 'cabin-shunt-2', secret: "it's-secret" }]);
    expect(options.broker).toBe('mqtt://127.0.0.1:1883');
    expect(SCENARIO_NAMES).toContain(options.scenarios[0]);
  });
});
