import { parseArgs, type ParseArgsConfig } from 'node:util';
import { OfflineSchedule } from './offline-schedule';
import { SCENARIO_NAMES } from './scenario-catalog';

/** Printed by --help and after a bad option. */
export const USAGE = `Usage: cellwarden-simulator --device ID:SECRET [options]
  --broker URL            MQTT broker (default mqtt://127.0.0.1:1883)
  --device ID:SECRET      device credentials, repeatable
  --fleet N               N devices ID-1 … ID-N sharing the one --device's secret, each its own seed,
                          scenarios dealt out in turn from --scenario (default: every scenario)
  --scenario NAME[,NAME]  a scenario below (default frost-night); a list is dealt out over the devices
  --seed N                random seed, whole number (default 1); device k uses seed + k
  --monitor-seed N        report as a second monitor on the bank that --seed plays: the same bank, this
                          monitor's own calibration and noise (the bank's lead monitor runs without it)
  --interval S            sample interval, simulated seconds (default 10)
  --count N               publish exactly N readings per device, then exit (fast unless --speed is given)
  --speed N               simulated seconds per real second (default 1); without --start a run faster
                          than real time replays the last 24 h and then carries on in real time
  --start ISO             simulated time of the first reading (default now)
  --resume                with --start in the past: carry the timeline on from there, sending only the
                          readings from now on (the earlier ones are already stored, e.g. the demo's history)
  --offline-every MIN     the monitor drops off every MIN simulated minutes …
  --offline-for MIN       … for MIN minutes, buffering readings and sending them on reconnect
  --list-scenarios        print the scenarios with their pack and charge sources
  --help                  show this text
Scenarios: ${SCENARIO_NAMES.join(', ')}`;

/** A command-line mistake, naming the argument; `run` turns it into exit code 2. */
export class CliArgumentError extends Error {
  constructor(
    readonly argument: string,
    message: string,
  ) {
    super(message);
    this.name = 'CliArgumentError';
  }
}

/** Parsed command line. */
export interface CliOptions {
  broker: string;
  devices: { id: string; secret: string }[];
  fleet?: number;
  scenarios: string[];
  seed: number;
  /** Play the bank of `seed` as seen by a second monitor whose errors come from this seed. */
  monitorSeed?: number;
  interval: number;
  count?: number;
  /** Undefined when not given: then a --count run goes as fast as the broker acknowledges. */
  speed?: number;
  start?: number;
  /** Send only the readings from now on of a timeline that began at `start`. */
  resume: boolean;
  offline?: OfflineSchedule;
  listScenarios: boolean;
  help: boolean;
}

function numberArg(name: string, text: string | undefined, check: (n: number) => boolean, rule: string) {
  if (text === undefined) return undefined;
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value) || !check(value)) {
    throw new CliArgumentError(name, `--${name} must be ${rule}; got ${JSON.stringify(text)}`);
  }
  return value;
}

const positive = (n: number) => n > 0;
const wholePositive = (n: number) => Number.isInteger(n) && n > 0;

function parseDevice(text: string) {
  const colon = text.indexOf(':');
  const id = text.slice(0, colon);
  const secret = text.slice(colon + 1);
  if (colon <= 0 || !secret)
    throw new CliArgumentError('device', `--device must be ID:SECRET; got ${JSON.stringify(text)}`);
  return { id, secret };
}

function parseScenarios(text: string | undefined, fleet: number | undefined): string[] {
  if (text === undefined) return fleet === undefined ? ['frost-night'] : [...SCENARIO_NAMES];
  const names = text.split(',').map((name) => name.trim());
  const unknown = names.find((name) => !SCENARIO_NAMES.includes(name));
  if (unknown !== undefined) {
    throw new CliArgumentError(
      'scenario',
      `--scenario must name one of ${SCENARIO_NAMES.join(', ')}; got ${JSON.stringify(unknown)}`,
    );
  }
  return names;
}

function parseStart(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const start = Date.parse(text);
  if (Number.isNaN(start))
    throw new CliArgumentError('start', `--start must be an ISO 8601 time; got ${JSON.stringify(text)}`);
  return start;
}

function parseOffline(
  every: string | undefined,
  forMinutes: string | undefined,
): OfflineSchedule | undefined {
  if (every === undefined && forMinutes === undefined) return undefined;
  if (every === undefined || forMinutes === undefined) {
    const missing = every === undefined ? 'offline-every' : 'offline-for';
    throw new CliArgumentError(
      missing,
      `--offline-every and --offline-for go together; --${missing} is missing`,
    );
  }
  const schedule = {
    everyMinutes: numberArg('offline-every', every, positive, 'a number of minutes above 0') as number,
    forMinutes: numberArg('offline-for', forMinutes, positive, 'a number of minutes above 0') as number,
  };
  if (schedule.forMinutes >= schedule.everyMinutes) {
    throw new CliArgumentError(
      'offline-for',
      `--offline-for must be shorter than --offline-every; got ${forMinutes}`,
    );
  }
  return schedule;
}

const OPTIONS = {
  broker: { type: 'string', default: 'mqtt://127.0.0.1:1883' },
  device: { type: 'string', multiple: true, default: [] as string[] },
  fleet: { type: 'string' },
  scenario: { type: 'string' },
  seed: { type: 'string', default: '1' },
  'monitor-seed': { type: 'string' },
  speed: { type: 'string' },
  interval: { type: 'string', default: '10' },
  count: { type: 'string' },
  start: { type: 'string' },
  resume: { type: 'boolean', default: false },
  'offline-every': { type: 'string' },
  'offline-for': { type: 'string' },
  'list-scenarios': { type: 'boolean', default: false },
  help: { type: 'boolean', default: false },
} satisfies ParseArgsConfig['options'];

/** Parses argv; throws CliArgumentError (or node's parseArgs error for an unknown option) naming the argument. */
export function parseCli(argv: string[]): CliOptions {
  const { values } = parseArgs({ args: argv, options: OPTIONS, strict: true, allowPositionals: false });
  const fleet = numberArg('fleet', values.fleet, wholePositive, 'a whole number above 0');
  const info = values.help || values['list-scenarios'];
  const devices = values.device.map(parseDevice);
  if (!info && devices.length === 0) throw new CliArgumentError('device', '--device ID:SECRET is required');
  if (fleet !== undefined && devices.length !== 1) {
    throw new CliArgumentError(
      'fleet',
      `--fleet needs exactly one --device to name the fleet; got ${devices.length}`,
    );
  }
  if (values.resume && values.start === undefined)
    throw new CliArgumentError('resume', '--resume needs --start: the time the timeline began');
  return {
    broker: values.broker,
    devices,
    fleet,
    scenarios: parseScenarios(values.scenario, fleet),
    seed: numberArg(
      'seed',
      values.seed,
      (n) => Number.isInteger(n) && n >= 0,
      'a whole number ≥ 0',
    ) as number,
    monitorSeed: numberArg(
      'monitor-seed',
      values['monitor-seed'],
      (n) => Number.isInteger(n) && n >= 0,
      'a whole number ≥ 0',
    ),
    interval: numberArg('interval', values.interval, positive, 'a number of seconds above 0') as number,
    count: numberArg('count', values.count, wholePositive, 'a whole number above 0'),
    speed: numberArg('speed', values.speed, positive, 'a number above 0'),
    start: parseStart(values.start),
    resume: values.resume,
    offline: parseOffline(values['offline-every'], values['offline-for']),
    listScenarios: values['list-scenarios'],
    help: values.help,
  };
}
