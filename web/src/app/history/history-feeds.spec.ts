import { resolutionText } from './history-feeds';

describe('resolutionText', () => {
  it('names raw data', () => expect(resolutionText('raw')).toBe('every stored reading'));
  it('names a single-unit bucket', () => expect(resolutionText('1h')).toBe('one point per hour'));
  it('names a bucket the server gives in seconds in minutes', () =>
    expect(resolutionText('240s')).toBe('one point per 4 min'));
  it('rounds an odd bucket to words, never thousands of seconds', () =>
    expect(resolutionText('15768s')).toBe('one point per 4 h 23 min'));
  it('names a bucket of a minute in seconds', () =>
    expect(resolutionText('60s')).toBe('one point per minute'));
  it('names a multi-unit bucket', () => expect(resolutionText('15m')).toBe('one point per 15 min'));
  it('names buckets of days', () => expect(resolutionText('172800s')).toBe('one point per 2 d'));
  it('passes through a resolution it does not know', () => expect(resolutionText('weekly')).toBe('weekly'));
});
