import {
  EARLIEST_QUERY_TIME,
  LATEST_QUERY_TIME,
  epochMsSchema,
  idSchema,
  isoTimeSchema,
} from './common-schemas';

describe('common schemas', () => {
  it('take an id in any uuid version and case, and name the field otherwise', () => {
    expect(idSchema('systemId').parse('0F8FAD5B-D9CB-469F-A165-70867728950E')).toBe(
      '0F8FAD5B-D9CB-469F-A165-70867728950E',
    );
    expect(idSchema('systemId').safeParse('00000000-0000-0000-0000-000000000000').success).toBe(true);
    for (const bad of ['', 'van', '0f8fad5b-d9cb-469f-a165-70867728950', 42, null]) {
      const result = idSchema('systemId').safeParse(bad);
      expect(result.success).toBe(false);
      expect(result.error?.issues[0].message).toBe('systemId must be an id');
    }
  });

  it('read an ISO 8601 time with a zone as a Date, and refuse one without a zone', () => {
    // ISO 8601-1:2019 §5.3.4: +02:00 is two hours ahead of UTC.
    expect(isoTimeSchema('from').parse('2026-12-03T14:00:00+02:00')).toEqual(
      new Date('2026-12-03T12:00:00Z'),
    );
    expect(isoTimeSchema('from').safeParse('2026-12-03T14:00:00').error?.issues[0].message).toBe(
      'from must be an ISO 8601 time',
    );
  });

  it('keep query times inside 1970 to 9999, both ends included', () => {
    expect(isoTimeSchema('to').parse('1970-01-01T00:00:00Z').getTime()).toBe(EARLIEST_QUERY_TIME);
    expect(isoTimeSchema('to').parse('9999-12-31T23:59:59.999Z').getTime()).toBe(LATEST_QUERY_TIME);
    expect(isoTimeSchema('to').safeParse('1969-12-31T23:59:59.999Z').error?.issues[0].message).toBe(
      'to must be between 1970-01-01 and 9999-12-31',
    );
  });

  it('take a time in ms from query text, refusing fractions, zero and words', () => {
    expect(epochMsSchema('before').parse('1796312395441')).toBe(1796312395441);
    for (const bad of ['1.5', '0', '-3', 'yesterday'])
      expect(epochMsSchema('before').safeParse(bad).success).toBe(false);
    expect(epochMsSchema('before').safeParse('yesterday').error?.issues[0].message).toBe(
      'before must be a time in ms',
    );
  });
});
