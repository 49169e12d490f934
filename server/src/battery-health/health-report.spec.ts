import { parse } from 'csv-parse/sync';
import { extractPdfText } from '../records/pdf-text-reader';
import { HEALTH_DISCLAIMERS, HEALTH_METHOD } from './health-method';
import { HEALTH_CSV_HEADER, healthReportCsv } from './health-report-csv';
import type { HealthReportInput } from './health-report-input';
import { renderHealthReport } from './health-report-pdf';
import { bandName, episodeLine, localDay, winAnsiText } from './health-report-text';

const HOUR = 3_600_000;
// 2026-01-14 20:00 UTC is 22:00 in Helsinki (UTC+2 in winter).
const COLD_START = Date.UTC(2026, 0, 14, 20);

function report(overrides: Partial<HealthReportInput> = {}): HealthReportInput {
  return {
    system: {
      name: 'Winter van =HYPERLINK("x")',
      kind: 'van',
      chemistry: 'lifepo4',
      nominalVoltage: 12,
      ratedCapacityAh: 200,
      usableCapacityAh: 190,
    },
    timeZone: 'Europe/Helsinki',
    requested: { from: Date.UTC(2025, 11, 1), to: Date.UTC(2026, 11, 1) },
    covered: { from: Date.UTC(2025, 11, 1), to: Date.UTC(2026, 10, 30, 22) },
    madeAt: Date.UTC(2026, 11, 3, 12),
    trend: {
      months: [{ monthStart: Date.UTC(2026, 0, 1) - 2 * HOUR, usableAh: 186.4, sigmaAh: 3.2, samples: 4 }],
      current: {
        usableAh: 180.2,
        sigmaAh: 3.1,
        stateOfHealth: 0.948,
        sigmaStateOfHealth: 0.016,
        asOf: Date.UTC(2026, 10, 28),
      },
    },
    samples: [
      {
        at: Date.UTC(2026, 0, 10, 6),
        fullAt: Date.UTC(2026, 0, 9, 14),
        usableAh: 186.4,
        sigmaAh: 6,
        countedAh: 150,
        socAtEnd: 0.2,
        method: 'rested-ocv',
        temperature: 8,
      },
    ],
    figures: {
      equivalentFullCycles: 75.5,
      ahIn: 14_000,
      ahOut: 13_800,
      whIn: 184_000,
      whOut: 176_000,
      chargeEfficiency: 0.956,
      depthOfDischarge: [
        { fromPercent: 0, toPercent: 10, cycles: 200 },
        { fromPercent: 80, toPercent: 90, cycles: 2 },
      ],
      temperatureHours: [
        { band: 'below-0', hours: 770 },
        { band: '10-35', hours: 4850 },
      ],
      hotAtHighChargeHours: 0,
      coldCharging: [
        {
          start: COLD_START,
          end: COLD_START + 8 * HOUR,
          ahIn: 22.5,
          lowestTemperature: -2.8,
          highestTemperature: -0.4,
        },
      ],
      hotCharging: [],
      hoursCovered: 8760,
    },
    words: ['Holds about 95 % of its rated usable capacity, ± 2 %.'],
    method: HEALTH_METHOD,
    unit: 'C',
    ...overrides,
  };
}

describe('health report text', () => {
  it('writes episode times in the system’s own clock', () => {
    expect(episodeLine(report().figures.coldCharging[0], 'Europe/Helsinki')).toBe(
      '2026-01-14 22:00 – 2026-01-15 06:00, 22.5 Ah in, pack −2.8 °C to −0.4 °C',
    );
    // °F = °C × 9/5 + 32 (NIST SP 811, §B.8): −2.8 °C is 27.0 °F, −0.4 °C is 31.3 °F.
    expect(episodeLine(report().figures.coldCharging[0], 'Europe/Helsinki', 'F')).toBe(
      '2026-01-14 22:00 – 2026-01-15 06:00, 22.5 Ah in, pack 27.0 °F to 31.3 °F',
    );
    expect(bandName('35-45', 'F')).toBe('95 °F to 113 °F');
    expect(bandName('below-0', 'C')).toBe('below 0 °C');
    expect(localDay(Date.UTC(2026, 0, 31, 23), 'Europe/Helsinki')).toBe('2026-02-01');
  });

  // WinAnsiEncoding (ISO 32000-1 Annex D.2) has ± ° – ’ but no σ, ≥, narrow no-break space or minus sign.
  it('keeps only what Helvetica can show', () => {
    expect(winAnsiText('± 3 °C – it’s')).toBe('± 3 °C – it’s');
    expect(winAnsiText('1\u202f234 Ah, −2 °C, 2σ ≥ x\u0007')).toBe('1 234 Ah, -2 °C, 2? ? x');
  });
});

// pdfkit writes – and ’ as WinAnsi 0x96 and 0x92 (ISO 32000-1 Annex D.2); Node's TextDecoder reads its
// 'windows-1252' label as Latin-1, so the reader hands them back as C1 controls, turned back here.
const pdfText = async (input: HealthReportInput) =>
  extractPdfText(await renderHealthReport(input, { compress: false }))
    .replace(/\u0096/g, '–')
    .replace(/\u0092/g, '’');

describe('health report PDF', () => {
  it('states the method, the estimate with its band, the evidence with the zone and the disclaimer', async () => {
    const text = await pdfText(report());
    expect(text).toContain('Cellwarden battery health report');
    expect(text).toContain('Usable capacity: 180.2 Ah ± 3.1 Ah (one standard deviation), as of 2026-11-28');
    expect(text).toContain('State of health: 95 % ± 2 % of the rated usable capacity');
    expect(text).toContain('2026-01: 186.4 ± 3.2 Ah (4)');
    expect(text).toContain('Charged while cold (1)');
    expect(text).toContain('2026-01-14 22:00 – 2026-01-15 06:00, 22.5 Ah in, pack -2.8 °C to -0.4 °C');
    expect(text).toContain('Times in Europe/Helsinki.');
    expect(text).toContain('Round-trip efficiency: 96 %');
    expect(text).toMatch(/coulomb counting with open-circuit-voltage recalibration/);
    for (const caution of HEALTH_DISCLAIMERS) expect(text).toContain(caution);
    expect(text).toContain('80–90 %: 2.0');
  });

  it('says so when the period holds no data and no estimate', async () => {
    const empty = report({
      covered: null,
      trend: { months: [] },
      samples: [],
      words: [],
      figures: { ...report().figures, coldCharging: [], hoursCovered: 0 },
    });
    const text = await pdfText(empty);
    expect(text).toContain('none: no hourly summaries were stored in this period');
    expect(text).toContain('No capacity estimate in this period');
    expect(text).toContain('Charged while cold (0)');
  });
});

describe('health report CSV', () => {
  it('is one table with a row per quantity, times in the system’s zone and in UTC', () => {
    const rows = parse(healthReportCsv(report()), { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual([...HEALTH_CSV_HEADER]);
    const find = (section: string, quantity: string) =>
      rows.find((r) => r.section === section && r.quantity === quantity)!;
    expect(find('capacity', 'usable capacity')).toMatchObject({ value: '180.2', band: '3.1', unit: 'Ah' });
    expect(find('capacity', 'state of health')).toMatchObject({ value: '94.8', band: '1.6', unit: '%' });
    expect(find('cold charging', 'charge in')).toMatchObject({
      value: '22.5',
      start_local: '2026-01-14 22:00',
      start_utc: '2026-01-14T20:00:00.000Z',
    });
    expect(find('temperature', 'below 0 °C').value).toBe('770');
    expect(rows.filter((r) => r.section === 'disclaimer')).toHaveLength(HEALTH_DISCLAIMERS.length);
  });

  it('writes temperatures in the reader’s unit when they prefer °F', () => {
    const rows = parse(healthReportCsv(report({ unit: 'F' })), { columns: true }) as Record<string, string>[];
    // 0 °C is 32 °F (NIST SP 811, §B.8).
    expect(rows.find((r) => r.section === 'temperature' && r.quantity === 'below 32 °F')?.value).toBe('770');
    const measured = rows.filter((r) => r.section !== 'disclaimer');
    expect(measured.some((r) => /°C/.test(Object.values(r).join(' ')))).toBe(false);
  });

  // OWASP "CSV Injection": a cell that starts with = is prefixed with a quote.
  it('keeps a system name from becoming a spreadsheet formula', () => {
    const rows = parse(healthReportCsv(report()), { columns: true }) as Record<string, string>[];
    expect(rows.find((r) => r.quantity === 'system')!.note).toBe('Winter van =HYPERLINK("x")');
    const named = parse(healthReportCsv(report({ system: { ...report().system, name: '=cmd' } })), {
      columns: true,
    }) as Record<string, string>[];
    expect(named.find((r) => r.quantity === 'system')!.note).toBe("'=cmd");
  });
});
