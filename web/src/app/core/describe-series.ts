/** What the summary reads of a point: the live chart's ChartPoint and history's points both have it. */
export interface SeriesPoint {
  voltage: number;
  current: number;
}

/** A sentence summarising voltage and current over some points, for screen readers beside a chart. */
export function describeSeries(points: readonly SeriesPoint[], span: string): string {
  if (points.length === 0) return `No readings ${span}.`;
  const voltages = points.map((p) => p.voltage);
  const currents = points.map((p) => p.current);
  const range = (values: number[], digits: number) =>
    `${Math.min(...values).toFixed(digits)} to ${Math.max(...values).toFixed(digits)}`;
  return (
    `${points.length} readings ${span}: voltage ${range(voltages, 2)} V, ` +
    `current ${range(currents, 1)} A (positive is charging).`
  );
}
