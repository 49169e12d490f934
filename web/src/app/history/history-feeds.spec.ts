import { resolutionText } from './history-feeds';

describe('resolutionText', () => {
  it('names raw data', () => expect(resolutionText('raw')).toBe('every stored reading'));
  it('names a single-unit bucket', () => expect(resolutionText('1h')).toBe('one point per hour'));
  it('names a multi-unit bucket', () => expect(resolutionText('15m')).toBe('one point per 15 minutes'));
  it('passes through a resolution it does not know', () => expect(resolutionText('weekly')).toBe('weekly'));
});
