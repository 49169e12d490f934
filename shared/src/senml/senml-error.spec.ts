import { TelemetryInputError } from '../telemetry/telemetry-input-error';
import { badNameError, SenmlError, wrongTypeError } from './senml-error';

describe('SenmlError', () => {
  it('is a TelemetryInputError with its own name', () => {
    const error = new SenmlError('senml_not_array', 'a SenML pack must be a JSON array; got {}');
    expect(error).toBeInstanceOf(TelemetryInputError);
    expect(error.name).toBe('SenmlError');
    expect(error.code).toBe('senml_not_array');
  });

  it('quotes the value of a wrongly typed label and points at it', () => {
    const error = wrongTypeError('[2].v', 'a number', '12.7');
    expect(error.code).toBe('senml_bad_type');
    expect(error.field).toBe('[2].v');
    expect(error.message).toBe('[2].v must be a number; got "12.7"');
  });

  it('quotes a bad name', () => {
    const error = badNameError('[0].n', 'volt age');
    expect(error.code).toBe('senml_bad_name');
    expect(error.message).toContain('got "volt age"');
  });
});
