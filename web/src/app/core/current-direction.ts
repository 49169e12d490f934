/** Below this magnitude the pack counts as idle, amperes. */
export const IDLE_CURRENT_A = 0.1;

/** Which way current flows through the pack. */
export type CurrentDirection = 'charging' | 'discharging' | 'idle';

/** Direction of a pack current (positive = into the battery). */
export function currentDirection(current: number): CurrentDirection {
  if (current > IDLE_CURRENT_A) return 'charging';
  if (current < -IDLE_CURRENT_A) return 'discharging';
  return 'idle';
}
