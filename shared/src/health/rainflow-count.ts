// Rainflow cycle counting of a state-of-charge history, streamed one point at a time so the stack of
// unclosed reversals can be persisted between runs (ASTM E1049-85, "Standard Practices for Cycle Counting in
// Fatigue Analysis", §5.4.4 rainflow counting — from memory). Depth of discharge of a counted cycle = its range.

/** A counted range and how many cycles it stands for (1, or 0.5 for a half cycle). */
export interface CountedRange {
  range: number;
  cycles: number;
}

/**
 * Adds one point to the reversal stack `points` (mutated) and returns the ranges it closes. The last point
 * stays provisional while the history keeps moving the same way.
 */
export function pushRainflowPoint(points: number[], value: number): CountedRange[] {
  const n = points.length;
  if (n > 0 && value === points[n - 1]) return [];
  const continuing = n >= 2 && (points[n - 1] - points[n - 2]) * (value - points[n - 1]) > 0;
  if (continuing) points[n - 1] = value;
  else points.push(value);
  return closeRanges(points);
}

/** The half cycles the unclosed reversals stand for if the history ended now (the standard's residue). */
export function residueRanges(points: readonly number[]): CountedRange[] {
  const ranges: CountedRange[] = [];
  for (let i = 1; i < points.length; i++) {
    ranges.push({ range: Math.abs(points[i] - points[i - 1]), cycles: 0.5 });
  }
  return ranges;
}

// The three-point rule: with X the newest range and Y the one before it, X ≥ Y closes Y — as a half cycle
// when Y holds the history's starting point (which is then dropped), else as a full cycle.
function closeRanges(points: number[]): CountedRange[] {
  const counted: CountedRange[] = [];
  while (points.length >= 3) {
    const n = points.length;
    const x = Math.abs(points[n - 1] - points[n - 2]);
    const y = Math.abs(points[n - 2] - points[n - 3]);
    if (x < y) break;
    if (n === 3) {
      counted.push({ range: y, cycles: 0.5 });
      points.shift();
    } else {
      counted.push({ range: y, cycles: 1 });
      points.splice(n - 3, 2);
    }
  }
  return counted;
}
