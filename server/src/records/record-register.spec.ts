import { renderCommissioningRecord } from './commissioning-record';
import type { CommissioningRecordInput } from './commissioning-record-input';
import { thinPoints } from './record-check-chart';
import { countPdfPages, extractPdfText } from './pdf-text-reader';

// The rebuilt record: cover with owner and zone, the install register's components and circuit table with
// each verdict and its rule, a check's chart drawn as vector paths, signature lines, photos on their own pages.
const chart = Array.from({ length: 120 }, (_, i) => ({
  at: Date.UTC(2026, 11, 2, 9, 0) + i * 1000,
  currentA: i < 10 ? i * 6 : 58 + (i % 3),
  voltage: 13.2 + i * 0.004,
}));

const record: CommissioningRecordInput = {
  system: {
    name: 'Winter van Moth',
    kind: 'van',
    battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 190 },
    bms: { continuousDischargeA: 150 },
    chargeSources: [{ id: 'dcdc', kind: 'dc-dc', label: 'DC-DC charger', ratedCurrentA: 60 }],
  },
  installer: { name: 'Tomas Brandt', company: 'Kestrel Hollow Vanfitters' },
  owner: { name: 'Ilse Varga', email: 'ilse@example.test' },
  recordedAt: Date.UTC(2026, 11, 2, 10, 0),
  timeZone: 'Europe/Helsinki',
  components: [
    { name: 'DC-DC charger 60 A', kind: 'charge source', ratings: 'dc-dc, rated 60 A' },
    { name: 'Inverter 2000 W', kind: 'inverter', ratings: '2000 W continuous, 4000 W surge, 10 W standby' },
  ],
  circuits: [
    {
      name: 'Heater feed',
      feeds: 'Diesel air heater',
      conductor: '12 AWG stranded, 105 °C, 3 m one way, 2 bundled',
      protection: '15 A blade fuse',
      fuseDistance: '1.5 m',
      verdict: 'FAIL',
      summary: 'a fuse 1.5 m from the battery leaves that conductor unprotected',
      rule: '33 CFR 183.455(b)',
    },
  ],
  checks: [
    {
      source: 'DC-DC charger',
      ratedCurrentA: 60,
      tolerancePercent: 10,
      windowSeconds: 120,
      meanCurrentA: 58.9,
      minCurrentA: 58,
      maxCurrentA: 60,
      ripplePeakToPeakA: 2,
      batteryVoltageReached: 13.7,
      cableDropV: 0.15,
      verdict: 'PASS',
      reasons: [],
      startedAt: chart[0].at,
      finishedAt: chart[chart.length - 1].at,
      chart,
    },
  ],
  photos: [
    { caption: 'Fuse block', data: null },
    { caption: 'Shunt', data: null },
  ],
};

describe('commissioning record with the install register', () => {
  it('puts system, owner, installer company, date and time zone on the cover', async () => {
    const text = extractPdfText(await renderCommissioningRecord(record));
    expect(text).toContain('System: Winter van Moth');
    expect(text).toContain('Owner: Ilse Varga <ilse@example.test>');
    expect(text).toContain('Installer company: Kestrel Hollow Vanfitters');
    // 10:00 UTC is 12:00 in Helsinki (EET, UTC+2, in December)
    expect(text).toMatch(/Date: .*12:00/);
    expect(text).toContain('Time zone: Europe/Helsinki');
  });

  it('lists the components and the circuit table with each verdict and the rule cited', async () => {
    const text = extractPdfText(await renderCommissioningRecord(record));
    expect(text).toContain('Inverter 2000 W (inverter): 2000 W continuous, 4000 W surge, 10 W standby');
    expect(text).toContain('Heater feed');
    expect(text).toContain('FAIL');
    expect(text).toContain('Rule: 33 CFR 183.455(b)');
  });

  it("draws the check's current and voltage as vector paths, with its time and settings", async () => {
    const pdf = await renderCommissioningRecord(record, { compress: false });
    const text = extractPdfText(pdf);
    expect(text).toContain('Current (A)');
    expect(text).toContain('Voltage (V)');
    expect(text).toContain('Settings: 60 A, tolerance ±10 %');
    expect(text).toMatch(/Time: .* to /);
    // ISO 32000-1 §8.5.2: `x y l` appends a line segment; two polylines of 120 points are at least 238 of them
    const segments = pdf.toString('latin1').match(/^[\d.-]+ [\d.-]+ l$/gm) ?? [];
    expect(segments.length).toBeGreaterThanOrEqual(238);
    expect(pdf.toString('latin1')).not.toMatch(/\/Subtype \/Image/);
  });

  it('ends with signature and date lines for installer and owner, and gives each photo its own page', async () => {
    const text = extractPdfText(await renderCommissioningRecord(record));
    expect(text).toContain('Installer: Tomas Brandt, Kestrel Hollow Vanfitters');
    expect(text).toContain('Owner: Ilse Varga');
    expect(text.match(/Signature/g)?.length).toBeGreaterThanOrEqual(2);
    const withoutPhotos = countPdfPages(await renderCommissioningRecord({ ...record, photos: [] }));
    const pages = countPdfPages(await renderCommissioningRecord(record));
    expect(pages).toBe(withoutPhotos + 2);
    expect(text).toContain(`Page ${pages} of ${pages}`);
  });

  it('thins a long chart evenly, keeping the last point', () => {
    const points = Array.from({ length: 1801 }, (_, i) => i);
    const thin = thinPoints(points, 400);
    expect(thin.length).toBeLessThanOrEqual(401);
    expect(thin[0]).toBe(0);
    expect(thin[thin.length - 1]).toBe(1800);
  });
});
