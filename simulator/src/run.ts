import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import type { IClientOptions, MqttClient } from 'mqtt';
import { parseCli, USAGE } from './cli';
import { SCENARIOS } from './scenario';
import { simulateReadings } from './simulate-readings';

/** What run needs from the outside world. */
export interface RunDeps {
  connect: (url: string, options: IClientOptions) => Promise<MqttClient>;
  now: () => number;
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Waits in real time; live runs pace readings with it. */
  sleep?: (ms: number) => Promise<void>;
}

// Without --count the simulator runs live: a day of readings, each sent when its measured time comes.
const LIVE_READINGS = 8640;

async function publishDevice(
  deps: RunDeps,
  broker: string,
  device: { id: string; secret: string },
  readings: ReturnType<typeof simulateReadings>['readings'],
  live: boolean,
) {
  const client = await deps.connect(broker, {
    username: device.id,
    password: device.secret,
    clientId: `cw-sim-${device.id}`,
    clean: false,
  });
  try {
    for (const reading of readings) {
      const due = reading.measuredAt - deps.now();
      if (live && due > 0 && deps.sleep) await deps.sleep(due);
      await client.publishAsync(
        readingsTopic(device.id),
        JSON.stringify(encodeReadingPack(device.id, [reading])),
        { qos: 1 },
      );
    }
  } finally {
    await client.endAsync();
  }
}

/** Runs the simulator from a command line; resolves to the process exit code. */
export async function run(argv: string[], deps: RunDeps): Promise<number> {
  let options;
  try {
    options = parseCli(argv);
  } catch (error) {
    deps.stderr(`${(error as Error).message}\n${USAGE}\n`);
    return 2;
  }
  if (options.help) {
    deps.stdout(`${USAGE}\n`);
    return 0;
  }
  const scenario = SCENARIOS[options.scenario];
  if (!scenario) {
    deps.stderr(`unknown scenario ${options.scenario}\n${USAGE}\n`);
    return 2;
  }
  const start = options.start ? Date.parse(options.start) : deps.now();
  const live = options.count === undefined;
  const count = options.count ?? LIVE_READINGS;
  await Promise.all(
    options.devices.map((device, index) => {
      const { readings } = simulateReadings(scenario, {
        seed: options.seed + index,
        start,
        intervalSeconds: options.interval,
        count,
      });
      return publishDevice(deps, options.broker, device, readings, live);
    }),
  );
  return 0;
}
