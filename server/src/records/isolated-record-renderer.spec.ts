import { crc32 } from 'node:zlib';
import type { CommissioningRecordInput } from './commissioning-record-input';
import { createRecordRenderer } from './isolated-record-renderer';
import { extractPdfText } from './pdf-text-reader';

// A PNG whose signature and header are right but whose image data is junk (W3C PNG spec, 2nd ed. §5:
// signature, then length, type, data and CRC-32 per chunk). pdfkit inflates PNG data in a zlib callback,
// where the failure escapes every handler: in the server's own thread that ended the process.
function pngWithJunkData(): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body) >>> 0);
    return Buffer.concat([length, body, crc]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(64, 0);
  header.writeUInt32BE(64, 4);
  header.set([8, 6, 0, 0, 0], 8); // 8-bit RGBA: pdfkit must decode it to split off the alpha channel
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', Buffer.from('not deflate data '.repeat(30))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

const record: CommissioningRecordInput = {
  system: {
    name: 'Grey Plover cabin',
    kind: 'cabin',
    battery: { chemistry: 'lifepo4', nominalVoltage: 24, ratedCapacityAh: 280, usableCapacityAh: 250 },
    bms: { continuousDischargeA: 200 },
    chargeSources: [{ id: 'solar', kind: 'solar', label: 'Roof solar', ratedCurrentA: 30 }],
  },
  installer: { name: 'Sam Field', company: 'Tallow Creek Solar' },
  recordedAt: Date.UTC(2026, 11, 2, 10, 0),
  checks: [],
  photos: [],
};

describe('createRecordRenderer', () => {
  it('renders a record in its own thread', async () => {
    const pdf = await createRecordRenderer().render(record);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(extractPdfText(pdf)).toContain('Grey Plover cabin');
  });

  it('answers a render that fails inside pdfkit with an error, and this process goes on', async () => {
    const renderer = createRecordRenderer();
    const failed = renderer.render({ ...record, photos: [{ caption: 'Junk', data: pngWithJunkData() }] });
    await expect(failed).rejects.toMatchObject({ code: 'record_render_failed', status: 500 });
    // The same renderer still works afterwards.
    expect(extractPdfText(await renderer.render(record))).toContain('Grey Plover cabin');
  });

  it('ends a render that outlasts its time limit', async () => {
    const renderer = createRecordRenderer({ timeoutMs: 1 });
    await expect(renderer.render(record)).rejects.toMatchObject({
      code: 'record_render_failed',
      message: expect.stringContaining('longer than'),
    });
  });

  it('refuses a render beyond the queue at once, and runs the queued ones in turn', async () => {
    const renderer = createRecordRenderer({ maxRunning: 1, maxWaiting: 1 });
    const outcomes = await Promise.allSettled([1, 2, 3].map(() => renderer.render(record)));
    expect(outcomes.map((o) => o.status)).toEqual(['fulfilled', 'fulfilled', 'rejected']);
    expect((outcomes[2] as PromiseRejectedResult).reason).toMatchObject({
      code: 'record_render_busy',
      status: 503,
    });
  });
});
