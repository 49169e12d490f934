import { deflateSync } from 'node:zlib';
import { renderCommissioningRecord } from './commissioning-record';
import type { CommissioningRecordInput } from './commissioning-record-input';
import { RECORD_CAUTIONS } from './record-cautions';
import { countPdfPages, extractPdfText } from './pdf-text-reader';

// A real PNG (W3C PNG spec, 2nd ed.: signature, IHDR, IDAT, IEND, each chunk with its CRC-32).
function tinyPng(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    return Buffer.concat([length, body, crc]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no filter method variant, no interlace
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(width * 3, 0x80)]);
  const pixels = deflateSync(Buffer.concat(Array.from({ length: height }, () => row)));
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([
    signature,
    chunk('IHDR', header),
    chunk('IDAT', pixels),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

// CRC-32 as PNG defines it (ISO 3309 polynomial 0xEDB88320, W3C PNG spec Annex D).
function crc32(bytes: Buffer): number {
  let crc = 0xffffffff;
  for (const byte of bytes) {
    crc ^= byte;
    for (let bit = 0; bit < 8; bit++) crc = crc & 1 ? (crc >>> 1) ^ 0xedb88320 : crc >>> 1;
  }
  return (crc ^ 0xffffffff) >>> 0;
}

// A JPEG's frame header only (ITU-T T.81 §B.2.2: SOI, SOF0 with precision, height, width, components;
// then EOI): enough for pdfkit, which embeds JPEG bytes as they are (/DCTDecode) and reads only the size.
const JPEG_FRAME = Buffer.from([
  0xff, 0xd8, 0xff, 0xc0, 0x00, 0x0b, 0x08, 0x00, 0x03, 0x00, 0x04, 0x01, 0x01, 0x11, 0x00, 0xff, 0xd9,
]);

const record: CommissioningRecordInput = {
  system: {
    name: 'Blue Heron van',
    kind: 'van',
    battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 180 },
    bms: { continuousDischargeA: 150 },
    chargeSources: [
      { id: 'solar', kind: 'solar', label: 'Roof solar', ratedCurrentA: 30 },
      { id: 'dcdc', kind: 'dc-dc', label: 'DC-DC charger', ratedCurrentA: 40 },
    ],
  },
  installer: { name: 'Sam Field', company: 'Tallow Creek Solar' },
  recordedAt: Date.UTC(2026, 11, 2, 10, 0),
  checks: [
    {
      source: 'Roof solar',
      ratedCurrentA: 30,
      tolerancePercent: 10,
      windowSeconds: 300,
      meanCurrentA: 29.1,
      minCurrentA: 27.9,
      maxCurrentA: 30.4,
      ripplePeakToPeakA: 0.8,
      batteryVoltageReached: 13.9,
      cableDropV: 0.12,
      verdict: 'PASS',
      reasons: [],
    },
    {
      source: 'DC-DC charger',
      ratedCurrentA: 40,
      tolerancePercent: 10,
      windowSeconds: 300,
      meanCurrentA: 31.2,
      minCurrentA: 30.1,
      maxCurrentA: 32,
      ripplePeakToPeakA: 1.9,
      batteryVoltageReached: 13.6,
      cableDropV: 0.61,
      verdict: 'FAIL',
      reasons: ['Mean current 31.2 A is below 36 A (40 A less 10 %)'],
    },
  ],
  photos: [{ caption: 'Fuse holder at the battery', data: tinyPng(8, 6) }],
};

describe('renderCommissioningRecord', () => {
  it('produces a PDF file: header and end-of-file marker (ISO 32000-1 §7.5.2, §7.5.5)', async () => {
    const pdf = await renderCommissioningRecord(record);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1').trim().endsWith('%%EOF')).toBe(true);
  });

  it('shows the title, the system, the installer, every verdict and reason, and page numbers', async () => {
    const text = extractPdfText(await renderCommissioningRecord(record));
    expect(text).toContain('Cellwarden commissioning record');
    expect(text).toContain('Blue Heron van');
    expect(text).toContain('LiFePO4, 12 V nominal, 200 Ah rated, 180 Ah usable');
    expect(text).toContain('Sam Field, Tallow Creek Solar');
    expect(text).toContain('1. Roof solar: PASS');
    expect(text).toContain('2. DC-DC charger: FAIL');
    expect(text).toContain('Mean current 31.2 A is below 36 A (40 A less 10 %)');
    expect(text).toContain('tolerance ±10 %');
    expect(text).toContain('Photo 1: Fuse holder at the battery');
    expect(text).toMatch(/Page 1 of \d/);
  });

  it('carries every safety caution', async () => {
    const text = extractPdfText(await renderCommissioningRecord(record));
    for (const caution of RECORD_CAUTIONS) expect(text).toContain(caution);
    expect(text).toContain('below 0 °C');
  });

  it('reads the same uncompressed', async () => {
    const pdf = await renderCommissioningRecord(record, { compress: false });
    expect(extractPdfText(pdf)).toContain('2. DC-DC charger: FAIL');
  });

  it('still renders with a corrupt photo, listing it', async () => {
    const corrupt = { caption: 'Shunt wiring', data: Buffer.from('MZ\x90\x00 not an image') };
    const truncated = { caption: 'Busbar', data: tinyPng(4, 4).subarray(0, 20) };
    const pdf = await renderCommissioningRecord({
      ...record,
      photos: [corrupt, truncated, ...record.photos],
    });
    const text = extractPdfText(pdf);
    expect(text).toContain('Photo 1: Shunt wiring (the image could not be read and is left out)');
    expect(text).toContain('Photo 2: Busbar (the image could not be read and is left out)');
    expect(text).toContain('Photo 3: Fuse holder at the battery');
    expect(text).not.toContain('Photo 3: Fuse holder at the battery (the image');
    // ISO 32000-1 §8.9.5: each embedded image is an XObject with /Subtype /Image; only the good one is.
    expect(pdf.toString('latin1').match(/\/Subtype \/Image/g)).toHaveLength(1);
  });

  it('embeds a JPEG photo as it is', async () => {
    const pdf = await renderCommissioningRecord({
      ...record,
      photos: [{ caption: 'Shunt', data: JPEG_FRAME }],
    });
    // ISO 32000-1 §7.4.8: DCTDecode streams carry JPEG data unchanged.
    expect(pdf.toString('latin1')).toMatch(/\/Filter \/DCTDecode/);
    expect(extractPdfText(pdf)).toContain('Photo 1: Shunt');
    expect(extractPdfText(pdf)).not.toContain('could not be read');
  });

  it('says so when there are no checks', async () => {
    const text = extractPdfText(await renderCommissioningRecord({ ...record, checks: [], photos: [] }));
    expect(text).toMatch(/no checks were recorded/i);
    expect(text).not.toContain('PASS');
  });

  it('numbers every page when the content runs over', async () => {
    const many = Array.from({ length: 12 }, (_, i) => ({ ...record.checks[1], source: `Source ${i + 1}` }));
    const pdf = await renderCommissioningRecord({ ...record, checks: many });
    const pages = countPdfPages(pdf);
    expect(pages).toBeGreaterThan(1);
    expect(extractPdfText(pdf)).toContain(`Page ${pages} of ${pages}`);
  });

  it('strips control characters from names', async () => {
    const text = extractPdfText(
      await renderCommissioningRecord({
        ...record,
        system: { ...record.system, name: 'Blue\r\nHeron\u0007' },
      }),
    );
    expect(text).toContain('System: Blue Heron');
  });
});
