import { z } from 'zod';
import { AppError } from '../errors/app-error';
import { parseNamingEveryField } from './every-field';

const schema = z.object({
  name: z.string({ error: 'name is required' }).min(1, 'name is required'),
  nominalVoltage: z.union([z.literal(12), z.literal(24)], { error: 'nominalVoltage must be 12 or 24' }),
  timeZone: z.string({ error: 'timeZone is required' }),
});

describe('parseNamingEveryField', () => {
  it('returns the parsed body when it is right', () => {
    expect(parseNamingEveryField(schema, { name: 'Van', nominalVoltage: 12, timeZone: 'UTC' })).toEqual({
      name: 'Van',
      nominalVoltage: 12,
      timeZone: 'UTC',
    });
  });

  it('names every wrong field in one 400, the first as its field', () => {
    let error: AppError | undefined;
    try {
      parseNamingEveryField(schema, { name: '', nominalVoltage: 36 });
    } catch (caught) {
      error = caught as AppError;
    }
    expect(error).toBeInstanceOf(AppError);
    expect([error!.status, error!.code, error!.field]).toEqual([400, 'invalid_input', 'name']);
    expect(error!.message).toBe(
      'name: name is required; nominalVoltage: nominalVoltage must be 12 or 24; timeZone: timeZone is required',
    );
  });

  it('treats a missing body as an empty object and a non-object as one wrong input', () => {
    expect(() => parseNamingEveryField(schema, undefined)).toThrow(/name: name is required/);
    expect(() => parseNamingEveryField(schema, [1, 2])).toThrow(AppError);
  });
});
