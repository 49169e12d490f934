import { CliArgumentError, CliOptions, parseCli, USAGE } from './cli';
import { PublisherDeps, publishDevice } from './device-publisher';
import { planDevices } from './fleet';
import { SCENARIO_SUMMARIES, SCENARIOS } from './scenario-catalog';

/** What run needs from the outside world. */
export interface RunDeps extends PublisherDeps {
  stderr: (text: string) => void;
}

// A run faster than real time without --start replays this much of the past, so no reading is in the future.
const REPLAY_MS = 24 * 3600 * 1000;

function parse(argv: string[], deps: RunDeps): CliOptions | undefined {
  try {
    return parseCli(argv);
  } catch (error) {
    const parseError =
      error instanceof CliArgumentError || (error as { code?: string }).code?.startsWith('ERR_PARSE_ARGS');
    if (!parseError) throw error;
    deps.stderr(`${(error as Error).message}\n\n${USAGE}\n`);
    return undefined;
  }
}

function listScenarios(deps: RunDeps): void {
  for (const s of SCENARIO_SUMMARIES) {
    const sources =
      s.chargeSources.map((c) => `${c.id} ${c.ratedCurrent} A`).join(', ') || 'no charge sources';
    deps.stdout(
      `${s.name}: ${s.nominalVoltage} V ${s.chemistry} ${s.ratedCapacityAh} Ah (${s.usableCapacityAh} Ah usable); ${sources}\n  ${s.description}\n`,
    );
  }
}

function startTime(options: CliOptions, now: number): number {
  if (options.start !== undefined) return options.start;
  return options.speed !== undefined && options.speed > 1 ? now - REPLAY_MS : now;
}

/** Runs the simulator from a command line; resolves to the process exit code (2 for a bad argument). */
export async function run(argv: string[], deps: RunDeps): Promise<number> {
  const options = parse(argv, deps);
  if (!options) return 2;
  if (options.help) {
    deps.stdout(`${USAGE}\n`);
    return 0;
  }
  if (options.listScenarios) {
    listScenarios(deps);
    return 0;
  }
  const schedule = {
    broker: options.broker,
    start: startTime(options, deps.now()),
    intervalSeconds: options.interval,
    count: options.count,
    // Without --count the simulator runs live, each reading sent when its measured time comes.
    speed: options.speed ?? (options.count === undefined ? 1 : undefined),
    resumeAt: options.resume ? deps.now() : undefined,
    monitorSeed: options.monitorSeed,
  };
  try {
    await Promise.all(
      planDevices(options).map((device) => {
        const scenario = SCENARIOS[device.scenario];
        return publishDevice(deps, device, scenario, {
          ...schedule,
          offline: options.offline ?? scenario.offline,
        });
      }),
    );
  } catch (error) {
    deps.stderr(`simulator stopped: ${(error as Error).message}\n`);
    return 1;
  }
  return 0;
}
