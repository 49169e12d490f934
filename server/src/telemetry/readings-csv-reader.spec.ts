import { Readable } from 'node:stream';
import { readReadingsCsv } from './readings-csv-reader';

const HEADER = 'measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w';
const NOW = Date.UTC(2026, 11, 3, 12, 0);
const row = (minutesAgo: number, voltage = '12.9') =>
  `${new Date(NOW - minutesAgo * 60_000).toISOString()},${voltage},-4.25,-3.5,55,-54.8`;
const source = (...chunks: string[]) => Readable.from(chunks.map((chunk) => Buffer.from(chunk)));

describe('readReadingsCsv', () => {
  it('reads every row of a file that arrives in pieces, split anywhere', async () => {
    const text = [HEADER, row(3), row(2), row(1)].join('\r\n');
    const readings = await readReadingsCsv(
      source(text.slice(0, 50), text.slice(50, 97), text.slice(97)),
      NOW,
    );
    expect(readings.map((r) => r.measuredAt)).toEqual([3, 2, 1].map((m) => NOW - m * 60_000));
    expect(readings[0]).toMatchObject({
      voltage: 12.9,
      current: -4.25,
      temperature: -3.5,
      stateOfCharge: 55,
    });
  });

  it('names the line and the column of a bad row', async () => {
    const text = [HEADER, row(3), '', row(2, '12.9V')].join('\n');
    await expect(readReadingsCsv(source(text), NOW)).rejects.toMatchObject({
      status: 400,
      field: 'voltage_v',
      message: expect.stringMatching(/^line 4: /),
    });
  });

  it('refuses a header that is not ours, naming it', async () => {
    await expect(readReadingsCsv(source('time,volts\n1,2'), NOW)).rejects.toMatchObject({
      status: 400,
      field: 'header',
    });
  });

  it('refuses an empty file and malformed CSV, naming the file', async () => {
    await expect(readReadingsCsv(source(''), NOW)).rejects.toMatchObject({ status: 400, field: 'file' });
    await expect(readReadingsCsv(source(`${HEADER}\n"${row(1)}`), NOW)).rejects.toMatchObject({
      status: 400,
      field: 'file',
      message: expect.stringMatching(/^line \d+: not valid CSV/),
    });
  });

  it('stops at the byte cap as the bytes arrive, without reading the rest', async () => {
    let pulled = 0;
    const endless = new Readable({
      read() {
        pulled++;
        this.push(Buffer.alloc(1024, 0x0a));
      },
    });
    await expect(readReadingsCsv(endless, NOW, { maxBytes: 64 * 1024 })).rejects.toMatchObject({
      status: 413,
      code: 'file_too_large',
      field: 'file',
    });
    expect(pulled).toBeLessThan(200);
  });

  it('stops at the row limit', async () => {
    const text = [HEADER, row(3), row(2), row(1)].join('\n');
    await expect(readReadingsCsv(source(text), NOW, { maxRows: 2 })).rejects.toMatchObject({
      status: 400,
      field: 'file',
      message: 'at most 2 rows per import; the file has more',
    });
  });
});
