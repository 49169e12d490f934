import PDFDocument from 'pdfkit';
import { collect, numberPages } from '../records/commissioning-record';
import { bullets, field, heading } from '../records/record-layout';
import { HEALTH_DISCLAIMERS } from './health-method';
import type { HealthReportInput } from './health-report-input';
import {
  bandName,
  CHEMISTRY_NAMES,
  episodeLine,
  localDay,
  localTime,
  temperatureText,
  winAnsiText,
} from './health-report-text';

/** The title printed at the top of every health report. */
export const HEALTH_REPORT_TITLE = 'Cellwarden battery health report';

const percent = (fraction: number) => `${(fraction * 100).toFixed(0)} %`;

/** Renders a battery health report as an A4 PDF in the built-in Helvetica (same look as the commissioning record). */
export function renderHealthReport(
  report: HealthReportInput,
  options: { compress?: boolean } = {},
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    bufferPages: true,
    compress: options.compress ?? true,
    info: { Title: HEALTH_REPORT_TITLE, Creator: 'Cellwarden', CreationDate: new Date(report.madeAt) },
  });
  const done = collect(doc);
  // Every string that reaches the page passes through here: Helvetica shows WinAnsi text only.
  const say = (label: string, value: string) => field(doc, label, winAnsiText(value));
  const zone = report.timeZone;

  doc.font('Helvetica-Bold').fontSize(18).text(HEALTH_REPORT_TITLE).fontSize(10).font('Helvetica');
  doc.moveDown(0.5);
  say('System', report.system.name);
  say(
    'Battery',
    `${CHEMISTRY_NAMES[report.system.chemistry] ?? report.system.chemistry}, ${report.system.nominalVoltage} V nominal, ` +
      `${report.system.ratedCapacityAh} Ah rated, ${report.system.usableCapacityAh} Ah usable`,
  );
  say(
    'Period asked for',
    `${localDay(report.requested.from, zone)} to ${localDay(report.requested.to - 1, zone)}`,
  );
  say(
    'Data in the period',
    report.covered
      ? `${localTime(report.covered.from, zone)} to ${localTime(report.covered.to, zone)}`
      : 'none: no hourly summaries were stored in this period',
  );
  say('Dates and times', `in the system's time zone, ${zone}`);
  say('Made', localTime(report.madeAt, zone));

  heading(doc, 'In short');
  if (report.words.length === 0) doc.text('Nothing to say yet: the period holds no data.');
  else bullets(doc, report.words.map(winAnsiText));

  heading(doc, 'Capacity estimate');
  const now = report.trend.current;
  if (!now)
    doc.text('No capacity estimate in this period: it needs a full charge followed by a rest or a cut-off.');
  else {
    say(
      'Usable capacity',
      `${now.usableAh.toFixed(1)} Ah ± ${now.sigmaAh.toFixed(1)} Ah (one standard deviation), as of ${localDay(now.asOf, zone)}`,
    );
    say(
      'State of health',
      `${percent(now.stateOfHealth)} ± ${percent(now.sigmaStateOfHealth)} of the rated usable capacity`,
    );
    say('Estimates in the period', String(report.samples.length));
    doc.moveDown(0.3).font('Helvetica-Bold').text('Month: estimate ± band (estimates)').font('Helvetica');
    bullets(
      doc,
      report.trend.months.map(
        (m) =>
          `${localDay(m.monthStart, zone).slice(0, 7)}: ${m.usableAh.toFixed(1)} ± ${m.sigmaAh.toFixed(1)} Ah (${m.samples})`,
      ),
    );
  }

  const f = report.figures;
  heading(doc, 'How the battery was used');
  say('Hours with data', f.hoursCovered.toLocaleString('en-GB'));
  say('Equivalent full cycles', f.equivalentFullCycles.toFixed(1));
  say('Charge in / out', `${f.ahIn.toFixed(0)} Ah / ${f.ahOut.toFixed(0)} Ah`);
  say('Energy in / out', `${(f.whIn / 1000).toFixed(1)} kWh / ${(f.whOut / 1000).toFixed(1)} kWh`);
  say(
    'Round-trip efficiency',
    f.chargeEfficiency === undefined ? 'not yet known (needs two full charges)' : percent(f.chargeEfficiency),
  );
  doc.moveDown(0.3).font('Helvetica-Bold').text('Hours by pack temperature').font('Helvetica');
  bullets(
    doc,
    f.temperatureHours.map((t) => winAnsiText(`${bandName(t.band, report.unit)}: ${t.hours.toFixed(0)} h`)),
  );
  say(
    winAnsiText(`Hours hot (${temperatureText(35, report.unit, 0)} or more) at 90 % charge or more`),
    f.hotAtHighChargeHours.toFixed(0),
  );
  doc.moveDown(0.3).font('Helvetica-Bold').text('Depth of discharge (cycles by depth)').font('Helvetica');
  bullets(
    doc,
    f.depthOfDischarge
      .filter((d) => d.cycles > 0)
      .map((d) => `${d.fromPercent}–${d.toPercent} %: ${d.cycles.toFixed(1)}`),
  );

  heading(doc, 'Evidence: charging outside the temperature limits');
  doc.text(`Times in ${zone}.`);
  doc
    .moveDown(0.2)
    .font('Helvetica-Bold')
    .text(`Charged while cold (${f.coldCharging.length})`)
    .font('Helvetica');
  if (f.coldCharging.length === 0) doc.text('None in this period.');
  else
    bullets(
      doc,
      f.coldCharging.map((e) => winAnsiText(episodeLine(e, zone, report.unit))),
    );
  doc
    .moveDown(0.2)
    .font('Helvetica-Bold')
    .text(`Charged while hot (${f.hotCharging.length})`)
    .font('Helvetica');
  if (f.hotCharging.length === 0) doc.text('None in this period.');
  else
    bullets(
      doc,
      f.hotCharging.map((e) => winAnsiText(episodeLine(e, zone, report.unit))),
    );

  heading(doc, 'Method');
  doc.text(winAnsiText(report.method));
  heading(doc, 'What this report is and is not');
  bullets(doc, HEALTH_DISCLAIMERS.map(winAnsiText));
  numberPages(doc);
  doc.end();
  return done;
}
