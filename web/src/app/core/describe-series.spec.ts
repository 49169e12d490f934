import { describeSeries } from './describe-series';

describe('describeSeries', () => {
  it('gives the voltage and current ranges with units', () => {
    const text = describeSeries(
      [
        { measuredAt: 1, voltage: 13.1, current: -4 },
        { measuredAt: 2, voltage: 13.42, current: 9.5 },
      ],
      'in the last 3 hours',
    );
    expect(text).toBe(
      '2 readings in the last 3 hours: voltage 13.10 to 13.42 V, current -4.0 to 9.5 A (positive is charging).',
    );
  });

  it('says when there is nothing to describe', () =>
    expect(describeSeries([], 'in the last 3 hours')).toBe('No readings in the last 3 hours.'));
});
