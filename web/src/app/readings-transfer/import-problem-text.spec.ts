import { importProblemText } from './import-problem-text';

describe('importProblemText', () => {
  it('names the line and the column of a refused row', () =>
    expect(
      importProblemText({
        status: 400,
        code: 'invalid_input',
        message: 'line 6: voltage_v must be a plain decimal number; got "=2+5"',
        field: 'voltage_v',
      }),
    ).toBe('line 6, column voltage_v: voltage_v must be a plain decimal number; got "=2+5"'));

  it('says what access an import needs when it is refused', () =>
    expect(
      importProblemText({
        status: 403,
        code: 'forbidden',
        message: 'Your access to this system does not include "configure"',
      }),
    ).toMatch(/needs configure access/));
});
