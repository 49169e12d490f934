import { checkPack } from './check-pack';
import { SenmlError } from './senml-error';

function refusal(pack: unknown): SenmlError {
  try {
    checkPack(pack);
  } catch (error) {
    expect(error).toBeInstanceOf(SenmlError);
    return error as SenmlError;
  }
  throw new Error('expected the pack to be refused');
}

describe('checkPack', () => {
  it('keeps the known labels and drops unknown ones', () => {
    // RFC 8428 §4.4: labels not ending in "_" may be ignored when not understood
    expect(checkPack([{ bn: 'a:', n: 'x', u: 'V', v: 1, t: 2, ut: 60, colour: 'red' }])).toEqual([
      { bn: 'a:', n: 'x', u: 'V', v: 1, t: 2, ut: 60 },
    ]);
  });

  it('accepts the empty pack', () => {
    expect(checkPack([])).toEqual([]);
  });

  it('refuses a pack that is not an array', () => {
    const error = refusal({ n: 'x', v: 1 });
    expect(error.code).toBe('senml_not_array');
    expect(error.field).toBeUndefined();
    expect(error.message).toBe('a SenML pack must be a JSON array; got {"n":"x","v":1}');
  });

  it.each([null, 3, 'x', [1]])('refuses a record that is %p', (record) => {
    const error = refusal([{ n: 'x', v: 1 }, record]);
    expect(error.code).toBe('senml_not_object');
    expect(error.field).toBe('[1]');
  });

  it.each([
    ['v', '12.7', 'a number'],
    ['t', null, 'a number'],
    ['n', 5, 'a string'],
    ['u', ['V'], 'a string'],
    ['vb', 'true', 'true or false'],
  ])('refuses %s holding %p', (label, value, expected) => {
    const record: Record<string, unknown> = { n: 'x', [label]: value };
    if (label !== 'vb') record['vs'] = 'ok';
    const error = refusal([record]);
    expect(error.code).toBe('senml_bad_type');
    expect(error.field).toBe(`[0].${label}`);
    expect(error.message).toContain(`must be ${expected}`);
  });

  it('refuses non-finite numbers handed over in-process', () => {
    const error = refusal([{ n: 'x', v: Number.NaN }]);
    expect(error.code).toBe('senml_not_finite');
    expect(error.field).toBe('[0].v');
  });

  it('refuses a must-understand label it does not understand', () => {
    // RFC 8428 §4.4: a record with an unknown label ending in "_" must be rejected
    const error = refusal([{ n: 'x', v: 1, rt_: 5 }]);
    expect(error.code).toBe('senml_must_understand');
    expect(error.field).toBe('[0].rt_');
  });

  it('refuses a version newer than RFC 8428', () => {
    // RFC 8428 §4.4: a version larger than the one understood must not be used
    const error = refusal([{ bver: 11, n: 'x', v: 1 }]);
    expect(error.code).toBe('senml_unsupported_version');
    expect(error.message).toBe('[0].bver must be at most 10; got 11');
    expect(refusal([{ bver: 2.5, n: 'x', v: 1 }]).code).toBe('senml_bad_type');
  });

  it('refuses two values in one record', () => {
    // RFC 8428 §4.2: exactly one value field
    const error = refusal([{ n: 'x', v: 1, vs: 'one' }]);
    expect(error.code).toBe('senml_multiple_values');
    expect(error.field).toBe('[0].vs');
  });

  it('refuses a record without a value, unless it carries a sum', () => {
    // RFC 8428 §4.2: no value field is allowed only when a sum is present
    const error = refusal([{ n: 'x', u: 'V' }]);
    expect(error.code).toBe('senml_no_value');
    expect(error.field).toBe('[0]');
    expect(checkPack([{ n: 'x', s: 3 }])).toEqual([{ n: 'x', s: 3 }]);
  });

  it('refuses a data value that is not unpadded base64url', () => {
    // RFC 8428 §5: vd is base64url without padding in JSON
    expect(refusal([{ n: 'x', vd: 'aGkgCg==' }]).code).toBe('senml_bad_data_value');
    expect(refusal([{ n: 'x', vd: 'a+b/' }]).field).toBe('[0].vd');
  });
});
