import { MIN_SPAN_PX, TimeAxis, spanPixels } from './alert-spans-plugin';

// A linear axis: 0 ms at x = 100 px, 1000 ms at x = 600 px (0.5 px per ms).
const axis: TimeAxis = { left: 100, right: 600, pixelFor: (v) => 100 + v / 2 };

describe('spanPixels', () => {
  it('maps a finished alert onto its pixels', () =>
    expect(spanPixels({ startedAt: 200, endedAt: 400, severity: 'warning' }, axis, 1000)).toEqual({
      x: 200,
      width: 100,
    }));

  it('runs an active alert to the end of the range', () =>
    expect(spanPixels({ startedAt: 800, endedAt: null, severity: 'critical' }, axis, 1000)).toEqual({
      x: 500,
      width: 100,
    }));

  it('clips an alert that began before the range', () =>
    expect(spanPixels({ startedAt: -500, endedAt: 100, severity: 'warning' }, axis, 1000)).toEqual({
      x: 100,
      width: 50,
    }));

  it('skips an alert wholly outside the range', () =>
    expect(spanPixels({ startedAt: 1200, endedAt: 1400, severity: 'warning' }, axis, 1000)).toBeNull());

  it('widens a momentary alert so it stays visible, inside the plot', () => {
    expect(spanPixels({ startedAt: 300, endedAt: 300, severity: 'warning' }, axis, 1000)?.width).toBe(
      MIN_SPAN_PX,
    );
    const atEnd = spanPixels({ startedAt: 1000, endedAt: 1000, severity: 'warning' }, axis, 1000);
    expect(atEnd).toEqual({ x: 600 - MIN_SPAN_PX, width: MIN_SPAN_PX });
  });
});
