import { DailyWindow, withinWindows } from './local-time';

/** A fuel-fired air heater under a thermostat, enabled during its schedule. */
export interface AirHeaterConfig {
  schedule: readonly DailyWindow[];
  /** Living-space temperature the thermostat aims for, °C. */
  setpoint: number;
  /** Switching band either side of the setpoint, K. */
  hysteresis: number;
}

/** Off, heating its glow plug to light the burner, or burning. */
export type HeaterPhase = 'off' | 'glow' | 'run';

/** Where the heater is in its cycle. */
export interface AirHeaterState {
  phase: HeaterPhase;
  phaseSeconds: number;
}

// Common practice values for a 2 kW diesel air heater on 12 V: the glow plug draws ~8–10 A for ~1–2 min
// at start-up, then the fan and fuel pump ~1–2 A. Watts keep the current right at 24 and 48 V too.
/** Draw while the glow plug lights the burner, W (≈ 9 A at 12 V, common practice). */
export const HEATER_GLOW_WATTS = 110;
/** How long the glow plug runs at start-up, s (common practice: 1–2 minutes). */
export const HEATER_GLOW_SECONDS = 90;
/** Steady draw while burning, W (≈ 1.5 A at 12 V, common practice). */
export const HEATER_RUN_WATTS = 18;

/** The heater's DC draw in its phase, W. */
export function heaterWatts(state: AirHeaterState): number {
  if (state.phase === 'glow') return HEATER_GLOW_WATTS;
  return state.phase === 'run' ? HEATER_RUN_WATTS : 0;
}

/** Advances the thermostat and start-up sequence by dt. */
export function stepAirHeater(
  state: AirHeaterState,
  config: AirHeaterConfig,
  cabinTemperature: number,
  hour: number,
  dtSeconds: number,
): AirHeaterState {
  const enabled = withinWindows(config.schedule, hour);
  const elapsed = state.phaseSeconds + dtSeconds;
  if (state.phase === 'off') {
    const wantsHeat = enabled && cabinTemperature < config.setpoint - config.hysteresis;
    return wantsHeat ? { phase: 'glow', phaseSeconds: 0 } : { phase: 'off', phaseSeconds: elapsed };
  }
  if (!enabled || cabinTemperature > config.setpoint + config.hysteresis) {
    return { phase: 'off', phaseSeconds: 0 };
  }
  if (state.phase === 'glow' && elapsed >= HEATER_GLOW_SECONDS) return { phase: 'run', phaseSeconds: 0 };
  return { phase: state.phase, phaseSeconds: elapsed };
}
