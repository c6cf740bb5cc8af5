// The fit report as a PDF: numbers with intervals and where they come from,
// the three plots as vector charts, the inputs, and the safety caution.
// Numbers are written as on screen: pressures in kPa, no exponent notation,
// dates in the reader's locale; every table repeats its headers on each page
// and every page is numbered. Sections flow on from one another, so the first
// page is never left half empty ahead of a forced page break.
import PDFDocument from 'pdfkit';
import { fitCurves, finiteDifferenceSpeeds, marksWithFit } from '../../shared/fits/curves';
import { formatGrouped, formatInterval, formatNumber, formatPressureKPa, formatSignificant, formatValue } from '../../shared/fits/format';
import { compareWithLauncherModels } from '../../shared/fits/launcher-efficiency';
import type { Estimate } from '../../shared/physics/types';
import { FIT_STATE_LABELS, type FitDetail } from '../../shared/schemas/fits';
import { drawChart } from './pdf-chart';
import { drawTable, numberPages } from './pdf-table';

export const SAFETY_TEXT = 'Launchers and pressure vessels can injure. Follow local codes, range-safety rules and licensed practice.';

const INK = '#1b2433';
const SECONDARY = '#3d4a5c';
const AMBER = '#d9822b';
const TEAL = '#1f7a72';
const VIOLET = '#7a6fa8';
const RED = '#b3261e';

type Doc = InstanceType<typeof PDFDocument>;

function heading(doc: Doc, text: string) {
  // A heading never ends a page: it goes with the first lines under it.
  keepTogether(doc, 60);
  doc.moveDown(0.6).font('Helvetica-Bold').fontSize(12).fillColor(INK).text(text, 50).moveDown(0.2);
  doc.font('Helvetica').fontSize(9).fillColor(INK);
}

/** A date and time in the reader's locale (the request's Accept-Language), with its time zone named. */
export function reportDateTime(iso: string | Date | null | undefined, locale?: string): string {
  if (!iso) return '—';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '—';
  const options: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC', timeZoneName: 'short' };
  try {
    return new Intl.DateTimeFormat(locale, options).format(date);
  } catch {
    return new Intl.DateTimeFormat('en-GB', options).format(date);
  }
}

/** Starts a new page when a block of this height would not fit above the bottom margin. */
function keepTogether(doc: Doc, height: number) {
  if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

// Sampled densely enough that the curves stay smooth at print resolution (300 dpi over the 495 pt plot width is about 2000 dots).
const CURVE_SAMPLES = 600;

export function buildFitReportPdf(fit: FitDetail, teamName: string, locale?: string): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, bufferPages: true, info: { Title: `Fit report: ${fit.shot.label}`, Author: 'Arcbench' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const r = fit.result;
  const s = fit.snapshot;
  const g = s.fitInput.gravityMps2;

  doc.font('Helvetica-Bold').fontSize(18).fillColor(INK).text(`Fit report: ${fit.shot.label}`);
  doc.font('Helvetica').fontSize(9).fillColor(SECONDARY);
  doc.text(`${teamName} · series ${fit.shot.seriesName ?? '—'} · launcher ${fit.shot.launcherName ?? '—'} · projectile ${fit.shot.projectileName ?? '—'}`);
  doc.text(`Fit ${fit.id} · run ${reportDateTime(fit.createdAt, locale)} by ${fit.createdBy?.displayName ?? 'unknown'} · state: ${FIT_STATE_LABELS[fit.state]}`);
  if (fit.reviewedBy) doc.text(`Reviewed ${reportDateTime(fit.reviewedAt, locale)} by ${fit.reviewedBy.displayName}${fit.reviewNote ? `: ${fit.reviewNote}` : ''}`);
  if (fit.staleness.message) doc.fillColor(RED).text(fit.staleness.message).fillColor(SECONDARY);

  // Safety first, where nobody can miss it.
  doc.moveDown(0.6);
  const boxY = doc.y;
  doc.font('Helvetica-Bold').fontSize(10).fillColor(RED).text('Safety', 60, boxY + 8);
  doc.font('Helvetica').fontSize(9).fillColor(INK).text(SAFETY_TEXT, 60, doc.y + 2, { width: 475 });
  const boxH = doc.y - boxY + 8;
  doc.rect(50, boxY, 495, boxH).lineWidth(1.2).strokeColor(RED).stroke();
  doc.y = boxY + boxH + 4;
  doc.x = 50;

  heading(doc, 'Results (95 % intervals)');
  const withUnit = (text: string, unit: string) => (unit ? `${text} ${unit}` : text);
  const est = (label: string, e: Estimate, unit: string) => [
    label,
    withUnit(formatValue(e), unit),
    withUnit(formatInterval(e), unit),
    withUnit(formatSignificant(e.stdErr, 2), unit),
  ];
  drawTable(doc, {
    headers: ['Quantity', 'Value', '95 % interval', 'Std. uncertainty'],
    widths: [150, 90, 150, 105],
    numeric: [1, 2, 3],
    rows: [
      est('Launch speed', r.launchSpeedMps, 'm/s'),
      est('Launch angle', r.launchAngleDeg, '°'),
      est('Drag coefficient Cd', r.dragCoefficient, ''),
      est('Drag constant k', r.dragK_perM, '1/m'),
      ...(r.muzzle ? [est('Muzzle speed', r.muzzle.speedMps, 'm/s')] : []),
      ['Ballistic coefficient', `${formatNumber(r.derived.ballisticCoefficientKgM2, 2)} kg/m²`, '', ''],
      ['RMS residual', `${(r.rmsResidualM * 1000).toFixed(2)} mm`, `${r.degreesOfFreedom} degrees of freedom`, ''],
    ],
  });
  doc.moveDown(0.3).font('Helvetica-Bold').fontSize(9).text(`Drag verdict: `, { continued: true }).font('Helvetica').text(r.dragVerdict);
  doc.text(`Headline numbers come from the ${r.model === 'quadratic-drag' ? 'quadratic-drag' : 'drag-free'} model. Drag-free fit: ${formatValue(r.dragFree.launchSpeedMps)} m/s at ${formatValue(r.dragFree.launchAngleDeg)}°; ${r.gravityCheck ? `gravity fitted freely in the drag model ${formatValue(r.gravityCheck.gravityMps2)} m/s²` : `free-fitted gravity ${formatValue(r.dragFree.freeGravityMps2)} m/s²`}.`);

  heading(doc, 'Where the uncertainty comes from (standard uncertainties)');
  drawTable(doc, {
    headers: ['Source', 'Launch speed (m/s)', 'Drag coefficient'],
    widths: [150, 170, 175],
    numeric: [1, 2],
    rows: r.uncertaintyBreakdown.map((u) => [u.source, formatSignificant(u.launchSpeedMps, 2), formatSignificant(u.dragCoefficient, 2)]),
  });

  heading(doc, 'Flow regime');
  doc.text(`Reynolds number ${formatGrouped(r.derived.reynoldsMin)} to ${formatGrouped(r.derived.reynoldsMax)}; peak Mach ${r.derived.machMax.toFixed(3)}; drag length ${formatNumber(r.derived.dragLengthM, 1)} m.`);
  for (const c of r.cautions) doc.fillColor(RED).text(`Caution: ${c}`).fillColor(INK);

  const launcher = compareWithLauncherModels(r, s);
  heading(doc, 'Launcher efficiency');
  if (launcher.rows.length === 0) doc.text(`Not computed: missing ${launcher.missing.join(', ')}.`);
  else {
    doc.text(`Measured speed (${launcher.measuredFrom}): ${launcher.measuredSpeedMps.toFixed(2)} m/s at ${formatPressureKPa(s.shot.chamberPressurePa)} gauge.`);
    for (const l of launcher.rows) {
      doc.text(`${l.label}: ${l.modelSpeedMps === null ? '—' : `${l.modelSpeedMps.toFixed(2)} m/s`}, efficiency ${l.efficiency === null ? '—' : `${(l.efficiency * 100).toFixed(1)} %`}${l.note ? ` (${l.note})` : ''}`);
    }
  }

  // Plots follow the numbers, each on the page it fits on.
  const marks = s.fitInput.marks;
  const curves = fitCurves(r, marks, g, CURVE_SAMPLES);
  const withFit = marksWithFit(r, marks, g);
  const chart = (height: number, draw: (box: { x: number; y: number; width: number; height: number }) => void) => {
    doc.moveDown(0.8);
    keepTogether(doc, height);
    // The chart's labels move pdfkit's cursor; the next block starts under the chart's box.
    const y = doc.y;
    draw({ x: 50, y, width: 495, height });
    doc.x = 50;
    doc.y = y + height + 4;
  };
  chart(230, (box) => drawChart(doc, box, 'Trajectory (world, m)', 'x (m)', 'y (m)', [
    { label: 'marks', points: marks.map((m) => ({ x: m.xM, y: m.yM })), color: AMBER, style: 'points' },
    { label: 'drag fit', points: curves.drag.map((p) => ({ x: p.xM, y: p.yM })), color: TEAL, style: 'line' },
    { label: 'drag-free fit', points: curves.dragFree.map((p) => ({ x: p.xM, y: p.yM })), color: VIOLET, style: 'dashed' },
  ]));
  chart(200, (box) => drawChart(doc, box, 'Residuals against time (mm)', 't (s)', 'residual (mm)', [
    { label: 'x residual', points: withFit.map((m) => ({ x: m.tS, y: m.xResidualM * 1000 })), color: AMBER, style: 'points' },
    { label: 'y residual', points: withFit.map((m) => ({ x: m.tS, y: m.yResidualM * 1000 })), color: TEAL, style: 'points' },
  ]));
  chart(220, (box) => drawChart(doc, box, 'Speed against time (m/s)', 't (s)', 'speed (m/s)', [
    { label: 'between marks', points: finiteDifferenceSpeeds(marks).map((p) => ({ x: p.tS, y: p.speedMps })), color: AMBER, style: 'points' },
    { label: 'drag fit', points: curves.drag.map((p) => ({ x: p.tS, y: p.speedMps })), color: TEAL, style: 'line' },
    { label: 'drag-free fit', points: curves.dragFree.map((p) => ({ x: p.tS, y: p.speedMps })), color: VIOLET, style: 'dashed' },
  ]));

  keepTogether(doc, 120);
  heading(doc, 'Inputs');
  const u = s.uncertainties;
  const lines = [
    `Projectile ${s.projectile.name}: mass ${s.projectile.massKg} kg (± ${u.massKg.value} kg, ${u.massKg.source}); diameter ${s.projectile.diameterM} m (± ${u.diameterM.value} m, ${u.diameterM.source}).`,
    `Air density ${s.air.densityKgM3.toFixed(4)} kg/m³ (± ${formatSignificant(u.airDensityKgM3.value, 2)} kg/m³, ${u.airDensityKgM3.source}); ${s.air.source}.`,
    `Shot conditions: ${formatNumber(s.shot.airTempC, 1)} °C, ${formatPressureKPa(s.shot.stationPressurePa)} station pressure, ${formatNumber(s.shot.relativeHumidityPct, 0)} %RH; chamber ${formatPressureKPa(s.shot.chamberPressurePa)} gauge; elevation ${formatNumber(s.shot.elevationDeg, 1)}°.`,
    `Calibration version ${s.calibration.version}: ${s.calibration.pixelsPerMetre.toFixed(3)} px/m, relative scale uncertainty ${formatSignificant(u.scaleRelative.value * 100, 2)} % (${u.scaleRelative.source}).`,
    `Track ${s.track.id} (${s.track.kind}), marks revision ${s.track.marksRevision}: ${marks.length} marks from ${marks[0]?.tS.toFixed(4)} s to ${marks[marks.length - 1]?.tS.toFixed(4)} s.`,
    s.muzzle ? `Muzzle at x ${s.muzzle.xM.toFixed(3)} m, y ${s.muzzle.yM.toFixed(3)} m.` : 'No muzzle marked.',
    `Gravity ${g ?? 9.80665} m/s². Input hash (sha256) ${fit.inputHash}.`,
  ];
  for (const l of lines) doc.text(l, { width: 495 }).moveDown(0.2);

  heading(doc, 'Marks and residuals');
  drawTable(doc, {
    headers: ['t (s)', 'x (m)', 'y (m)', 'fit x (m)', 'fit y (m)', 'res x (mm)', 'res y (mm)'],
    widths: [60, 70, 70, 70, 70, 70, 85],
    numeric: [0, 1, 2, 3, 4, 5, 6],
    rows: withFit.map((m) => [
      m.tS.toFixed(5),
      m.xM.toFixed(4),
      m.yM.toFixed(4),
      m.fittedXM.toFixed(4),
      m.fittedYM.toFixed(4),
      (m.xResidualM * 1000).toFixed(2),
      `${(m.yResidualM * 1000).toFixed(2)}${m.outlier ? ' outlier' : ''}`,
    ]),
  });
  numberPages(doc);
  doc.end();
  return done;
}
