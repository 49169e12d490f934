import { neutraliseSpreadsheetFormula } from './spreadsheet-formula';

describe('neutraliseSpreadsheetFormula', () => {
  // OWASP "CSV Injection": cells starting with =, +, -, @, TAB or CR are prefixed with a single quote;
  // OWASP ASVS 5.0 V1.2.10 adds NUL.
  it.each([
    ['=HYPERLINK("http://x.test","click")', `'=HYPERLINK("http://x.test","click")`],
    ['+SUM(A1:A9)', "'+SUM(A1:A9)"],
    ["-2+3+cmd|' /C calc'!A0", "'-2+3+cmd|' /C calc'!A0"],
    ['@SUM(1,1)', "'@SUM(1,1)"],
    ['\t=1+1', "'\t=1+1"],
    ['\r=1+1', "'\r=1+1"],
    ['\u0000=1', "'\u0000=1"],
  ])('prefixes %j', (cell, expected) => {
    expect(neutraliseSpreadsheetFormula(cell)).toBe(expected);
  });

  it.each(['Roof solar', '13.2', '-4.1', '+3e2', '', "'already quoted"])('leaves %j unchanged', (cell) => {
    expect(neutraliseSpreadsheetFormula(cell)).toBe(cell);
  });
});
