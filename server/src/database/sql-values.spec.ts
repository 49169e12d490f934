import { arrayLiteral } from './sql-values';

// PostgreSQL documentation §8.15.6 (Array Value Input): double quotes around an element, a backslash before an
// embedded double quote or backslash, NULL unquoted for a null element. The round trip through PostgreSQL's
// own parser is in test/integration/array-literal.test.ts.
describe('arrayLiteral', () => {
  it('quotes strings and leaves NULL bare', () => {
    expect(arrayLiteral(['a', null, 'NULL'])).toBe('{"a",NULL,"NULL"}');
  });

  it('escapes a double quote and a backslash inside an element', () => {
    expect(arrayLiteral(['{"A":1.5}', 'c:\\d'])).toBe('{"{\\"A\\":1.5}","c:\\\\d"}');
  });

  it('writes numbers as JavaScript does, which float8 input reads back exactly', () => {
    expect(arrayLiteral([13.1, -4.5, 0, 1e-7, 12345678901234])).toBe('{13.1,-4.5,0,1e-7,12345678901234}');
  });

  it('gives the empty array for no values', () => {
    expect(arrayLiteral([])).toBe('{}');
  });
});
