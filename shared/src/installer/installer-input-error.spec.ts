import { InstallerInputError, requireNumberInRange, requireOneOf } from './installer-input-error';

describe('installer input errors', () => {
  it('names the field and quotes the value for each kind of bad number', () => {
    const range = { min: 0, max: 100, exclusiveMin: true, unit: 'm' };
    expect(() => requireNumberInRange('oneWayLengthM', '3', range)).toThrow(
      new InstallerInputError(
        'installer-input-not-finite',
        'oneWayLengthM',
        'oneWayLengthM must be a finite number; got "3"',
      ),
    );
    expect(() => requireNumberInRange('oneWayLengthM', -2, range)).toThrow(
      expect.objectContaining({ code: 'installer-input-not-positive', field: 'oneWayLengthM' }),
    );
    expect(() => requireNumberInRange('oneWayLengthM', 120, range)).toThrow(
      'oneWayLengthM must be above 0 up to 100 m; got 120',
    );
    expect(requireNumberInRange('oneWayLengthM', 100, range)).toBe(100);
  });

  it('lists the allowed values when a choice is not one of them', () => {
    expect(() => requireOneOf('systemVoltage', 36, [12, 24, 48])).toThrow(
      expect.objectContaining({
        code: 'installer-input-not-allowed',
        message: 'systemVoltage must be one of 12, 24, 48; got 36',
      }),
    );
    expect(requireOneOf('systemVoltage', 24, [12, 24, 48])).toBe(24);
  });
});
