import { Rng } from './mulberry32';

/** A 12/24 V compressor fridge that cycles on its own thermostat. */
export interface FridgeConfig {
  /** Draw while the compressor runs, W (≈ 45 W, 3.5–4 A at 12 V, common practice). */
  watts: number;
  /** Typical compressor run, minutes. */
  onMinutes: number;
}

/** Whether the compressor runs and for how much longer. */
export interface FridgeState {
  running: boolean;
  remainingSeconds: number;
}

/** Fraction of time the compressor runs: more in a warm space (illustrative, common practice range). */
export function fridgeDutyCycle(spaceTemperature: number): number {
  return Math.min(0.8, Math.max(0.1, 0.3 + 0.02 * (spaceTemperature - 15)));
}

/** Advances the compressor cycle by dt; each phase length is jittered ±20 % by the generator. */
export function stepFridge(
  state: FridgeState,
  config: FridgeConfig,
  spaceTemperature: number,
  dtSeconds: number,
  rng: Rng,
): FridgeState {
  const remainingSeconds = state.remainingSeconds - dtSeconds;
  if (remainingSeconds > 0) return { running: state.running, remainingSeconds };
  const jitter = 0.8 + 0.4 * rng();
  const onSeconds = config.onMinutes * 60 * jitter;
  if (state.running) {
    const duty = fridgeDutyCycle(spaceTemperature);
    return { running: false, remainingSeconds: (onSeconds * (1 - duty)) / duty };
  }
  return { running: true, remainingSeconds: onSeconds };
}

/** The fridge's DC draw, W. */
export function fridgeWatts(state: FridgeState, config: FridgeConfig): number {
  return state.running ? config.watts : 0;
}
