// A check's current and voltage over its window, drawn with pdfkit's own vector graphics (paths and text):
// no browser, no canvas, so the record renders in the worker thread with nothing native.
import type { RecordChartPoint } from './commissioning-record-input';
import { contentBottom, contentWidth } from './record-layout';

const HEIGHT = 130;
const AXIS_GUTTER = 34;
// Cellwarden's copper for current and night indigo for voltage, as on the dashboard.
const CURRENT_COLOUR = '#b0622d';
const VOLTAGE_COLOUR = '#3a3f7a';
const GRID_COLOUR = '#c8c8c8';
/** At most this many points are drawn; more are thinned evenly (a 30-minute window at 1 Hz is 1,800). */
export const MAX_CHART_POINTS = 400;

/** Every k-th point so that at most `max` remain, always keeping the last. */
export function thinPoints<T>(points: readonly T[], max = MAX_CHART_POINTS): T[] {
  if (points.length <= max) return [...points];
  const step = Math.ceil(points.length / max);
  const kept = points.filter((_, i) => i % step === 0);
  if (kept[kept.length - 1] !== points[points.length - 1]) kept.push(points[points.length - 1]);
  return kept;
}

/** A tidy axis span around the values (at least `minSpan` wide). */
function span(values: number[], minSpan: number, fromZero: boolean): [number, number] {
  let low = fromZero ? Math.min(0, ...values) : Math.min(...values);
  let high = Math.max(...values);
  if (high - low < minSpan) {
    const mid = (high + low) / 2;
    low = fromZero ? Math.min(0, mid - minSpan / 2) : mid - minSpan / 2;
    high = low + minSpan;
  }
  const pad = (high - low) * 0.08;
  return [fromZero && low >= 0 ? 0 : low - pad, high + pad];
}

/** Draws the chart at the current position (on a new page when it would not fit) and moves below it. */
export function drawCheckChart(
  doc: PDFKit.PDFDocument,
  input: readonly RecordChartPoint[],
  ratedCurrentA: number,
): void {
  const points = thinPoints(input.filter((p) => Number.isFinite(p.currentA) && Number.isFinite(p.voltage)));
  if (points.length < 2) return void doc.text('Chart: too few readings in this window to draw.');
  if (doc.y + HEIGHT + 40 > contentBottom(doc)) doc.addPage();
  const left = doc.page.margins.left + AXIS_GUTTER;
  const width = contentWidth(doc) - 2 * AXIS_GUTTER;
  const top = doc.y + 14;
  const bottom = top + HEIGHT;
  const t0 = points[0].at;
  const seconds = (points[points.length - 1].at - t0) / 1000;
  const [aLow, aHigh] = span([...points.map((p) => p.currentA), ratedCurrentA], 5, true);
  const [vLow, vHigh] = span(
    points.map((p) => p.voltage),
    0.5,
    false,
  );
  const x = (at: number) => left + ((at - t0) / 1000 / seconds) * width;
  const yA = (a: number) => bottom - ((a - aLow) / (aHigh - aLow)) * HEIGHT;
  const yV = (v: number) => bottom - ((v - vLow) / (vHigh - vLow)) * HEIGHT;

  doc.save().fontSize(7).font('Helvetica');
  doc.fillColor(CURRENT_COLOUR).text('Current (A)', left - AXIS_GUTTER, top - 12, { lineBreak: false });
  doc.fillColor(VOLTAGE_COLOUR).text('Voltage (V)', left + width - 20, top - 12, { lineBreak: false });
  for (let i = 0; i <= 4; i++) {
    const y = top + (HEIGHT * i) / 4;
    doc
      .moveTo(left, y)
      .lineTo(left + width, y)
      .lineWidth(0.4)
      .strokeColor(GRID_COLOUR)
      .stroke();
    const amps = aHigh - ((aHigh - aLow) * i) / 4;
    const volts = vHigh - ((vHigh - vLow) * i) / 4;
    doc.fillColor(CURRENT_COLOUR).text(amps.toFixed(0), left - AXIS_GUTTER, y - 3, {
      width: AXIS_GUTTER - 4,
      align: 'right',
      lineBreak: false,
    });
    doc.fillColor(VOLTAGE_COLOUR).text(volts.toFixed(2), left + width + 4, y - 3, { lineBreak: false });
  }
  doc.rect(left, top, width, HEIGHT).lineWidth(0.6).strokeColor('#555555').stroke();
  // The rating the check judged against, dashed.
  doc
    .moveTo(left, yA(ratedCurrentA))
    .lineTo(left + width, yA(ratedCurrentA))
    .dash(3, { space: 3 })
    .lineWidth(0.6)
    .strokeColor(CURRENT_COLOUR)
    .stroke()
    .undash();
  polyline(
    doc,
    points.map((p) => [x(p.at), yA(p.currentA)]),
    CURRENT_COLOUR,
    1.2,
  );
  polyline(
    doc,
    points.map((p) => [x(p.at), yV(p.voltage)]),
    VOLTAGE_COLOUR,
    1,
  );
  doc.fillColor('#333333');
  doc.text('0 s', left - 4, bottom + 3, { lineBreak: false });
  doc.text(`${Math.round(seconds)} s`, left + width - 20, bottom + 3, {
    width: 24,
    align: 'right',
    lineBreak: false,
  });
  doc.text(`dashed: rated ${ratedCurrentA} A`, left + width / 2 - 40, bottom + 3, { lineBreak: false });
  doc.restore();
  doc.x = doc.page.margins.left;
  doc.y = bottom + 16;
}

function polyline(doc: PDFKit.PDFDocument, xy: number[][], colour: string, lineWidth: number): void {
  doc.moveTo(xy[0][0], xy[0][1]);
  for (const [px, py] of xy.slice(1)) doc.lineTo(px, py);
  doc.lineWidth(lineWidth).strokeColor(colour).stroke();
}
