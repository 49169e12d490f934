// OWASP "CSV Injection" and ASVS 5.0 V1.2.10: a cell starting with = + - @ TAB CR or NUL is read as a
// formula by spreadsheets, so exports prefix it with a single quote.
// eslint-disable-next-line no-control-regex -- NUL starts a formula in some spreadsheets
const FORMULA_START = /^[=+\-@\t\r\u0000]/;
// A plain number ("-12.5", "+3e2") cannot hold a formula; quoting it would turn every discharge
// current into text in the spreadsheet, so numbers pass unchanged (a deliberate narrowing).
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** One CSV export cell made inert for spreadsheets: a leading formula character gets a `'` before it. */
export function neutraliseSpreadsheetFormula(cell: string): string {
  if (PLAIN_NUMBER.test(cell)) return cell;
  return FORMULA_START.test(cell) ? `'${cell}` : cell;
}
