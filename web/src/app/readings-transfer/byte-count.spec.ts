import { formatByteCount } from './byte-count';

describe('formatByteCount', () => {
  // SI prefixes (BIPM SI Brochure, 9th ed., table 7): k = 10^3, M = 10^6.
  it('counts in bytes, kilobytes and megabytes with SI prefixes', () => {
    expect(formatByteCount(820, 'en-US')).toBe('820 bytes');
    expect(formatByteCount(12_400, 'en-US')).toBe('12.4 kB');
    expect(formatByteCount(3_140_000, 'en-US')).toBe('3.1 MB');
  });

  it('writes the number in the viewer’s locale', () =>
    expect(formatByteCount(3_140_000, 'de-DE')).toBe('3,1 MB'));
});
