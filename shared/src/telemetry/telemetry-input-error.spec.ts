import { quoteValue, TelemetryInputError } from './telemetry-input-error';

describe('TelemetryInputError', () => {
  it('carries a stable code, the offending field and the cause', () => {
    const cause = new SyntaxError('Unexpected token');
    const error = new TelemetryInputError('payload_not_json', 'payload is not JSON', { field: '[0]', cause });
    expect(error).toBeInstanceOf(Error);
    expect(error.code).toBe('payload_not_json');
    expect(error.field).toBe('[0]');
    expect(error.cause).toBe(cause);
  });

  it('leaves the field undefined for whole-payload problems', () => {
    expect(new TelemetryInputError('payload_too_large', 'too large').field).toBeUndefined();
  });
});

describe('quoteValue', () => {
  it('renders numbers bare and strings as JSON', () => {
    expect(quoteValue(612)).toBe('612');
    expect(quoteValue(Number.NaN)).toBe('NaN');
    expect(quoteValue('12 V')).toBe('"12 V"');
    expect(quoteValue(undefined)).toBe('nothing');
    expect(quoteValue(null)).toBe('null');
  });

  it('shortens long values so a hostile payload cannot flood the logs', () => {
    const quoted = quoteValue('x'.repeat(10_000));
    expect(quoted.length).toBeLessThan(70);
    expect(quoted.endsWith('…')).toBe(true);
  });
});
