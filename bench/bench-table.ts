/** One line of the bench's table: what was measured, the figure, what it is compared with, and the ratio. */
export interface Row {
  what: string;
  value: string;
  against: string;
  ratio: string;
}

/** Prints the rows as one aligned plain-text table (pastes into Markdown as a code block). */
export function printTable(rows: readonly Row[]): void {
  const header: Row = { what: 'measured', value: 'figure', against: 'against', ratio: 'ratio' };
  const all = [header, ...rows];
  const width = (key: keyof Row) => Math.max(...all.map((r) => r[key].length));
  const line = (r: Row) =>
    [
      r.what.padEnd(width('what')),
      r.value.padEnd(width('value')),
      r.against.padEnd(width('against')),
      r.ratio,
    ].join(' | ');
  console.log(['', line(header), '-'.repeat(line(header).length), ...rows.map(line)].join('\n'));
}
