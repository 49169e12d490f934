import { parseArgs } from 'node:util';

/** Printed by --help and after a bad option. */
export const USAGE = `Usage: cellwarden-simulator [options]
  --broker URL        MQTT broker (default mqtt://127.0.0.1:1883)
  --device ID:SECRET  device credentials, repeatable
  --scenario NAME     frost-night | driving-day (default frost-night)
  --seed N            random seed (default 1)
  --speed N           simulated seconds per real second (default 1)
  --interval S        sample interval, simulated seconds (default 10)
  --count N           publish exactly N readings per device, then exit
  --start ISO         simulated start time (default now)
  --help              show this text`;

/** Parsed command line. */
export interface CliOptions {
  broker: string;
  devices: { id: string; secret: string }[];
  scenario: string;
  seed: number;
  speed: number;
  interval: number;
  count?: number;
  start?: string;
  help: boolean;
}

/** Parses argv; throws with a message quoting the bad value. */
export function parseCli(argv: string[]): CliOptions {
  const { values } = parseArgs({
    args: argv,
    options: {
      broker: { type: 'string', default: 'mqtt://127.0.0.1:1883' },
      device: { type: 'string', multiple: true, default: [] },
      scenario: { type: 'string', default: 'frost-night' },
      seed: { type: 'string', default: '1' },
      speed: { type: 'string', default: '1' },
      interval: { type: 'string', default: '10' },
      count: { type: 'string' },
      start: { type: 'string' },
      help: { type: 'boolean', default: false },
    },
  });
  const devices = values.device.map((d) => {
    const [id, secret] = d.split(':');
    if (!id || !secret) throw new Error(`--device must be id:secret; got ${d}`);
    return { id, secret };
  });
  return {
    broker: values.broker,
    devices,
    scenario: values.scenario,
    seed: Number(values.seed),
    speed: Number(values.speed),
    interval: Number(values.interval),
    count: values.count === undefined ? undefined : Number(values.count),
    start: values.start,
    help: values.help,
  };
}
