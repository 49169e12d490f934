import { CliOptions } from './cli';

/** One simulated monitor: its credentials, its own seed and the scenario it plays. */
export interface DevicePlan {
  id: string;
  secret: string;
  seed: number;
  scenario: string;
}

/** The monitors a command line asks for: `--fleet N` makes ID-1 … ID-N; scenarios are dealt out in turn. */
export function planDevices(
  options: Pick<CliOptions, 'devices' | 'fleet' | 'scenarios' | 'seed'>,
): DevicePlan[] {
  const devices =
    options.fleet === undefined
      ? options.devices
      : Array.from({ length: options.fleet }, (_, k) => ({
          id: `${options.devices[0].id}-${k + 1}`,
          secret: options.devices[0].secret,
        }));
  return devices.map((device, k) => ({
    ...device,
    seed: options.seed + k,
    scenario: options.scenarios[k % options.scenarios.length],
  }));
}
