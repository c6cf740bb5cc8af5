// Vector line charts drawn straight into a pdfkit document: axes with round
// ticks, polylines (solid or dashed) and point series. Enough for the report's
// three plots without rasterising anything.
import type PDFDocument from 'pdfkit';

type Doc = InstanceType<typeof PDFDocument>;

export interface ChartSeries {
  label: string;
  points: { x: number; y: number }[];
  color: string;
  style: 'line' | 'dashed' | 'points';
}

export interface ChartBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

const INK = '#1b2433';
const FAINT = '#6b7686';
const HAIRLINE = '#e2dccf';

/** Round tick values covering [lo, hi] (1-2-5 steps). */
export function niceTicks(lo: number, hi: number, target = 5): number[] {
  if (!(hi > lo)) {
    const pad = Math.abs(lo) * 0.1 || 1;
    lo -= pad;
    hi += pad;
  }
  const raw = (hi - lo) / target;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  // From the step at or below lo to the step at or above hi, so the axes hold every point.
  const first = Math.floor(lo / step + 1e-9);
  const last = Math.ceil(hi / step - 1e-9);
  const ticks: number[] = [];
  for (let i = first; i <= last; i++) ticks.push(Number((i * step).toPrecision(12)));
  return ticks;
}

function tickLabel(v: number, ticks: number[]): string {
  const step = ticks.length > 1 ? Math.abs(ticks[1] - ticks[0]) : 1;
  const decimals = Math.max(0, Math.min(6, -Math.floor(Math.log10(step))));
  return v.toFixed(decimals);
}

export function drawChart(doc: Doc, box: ChartBox, title: string, xLabel: string, yLabel: string, series: ChartSeries[]) {
  const all = series.flatMap((s) => s.points).filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y));
  const xs = all.map((p) => p.x);
  const ys = all.map((p) => p.y);
  const xt = niceTicks(Math.min(...xs), Math.max(...xs));
  const yt = niceTicks(Math.min(...ys), Math.max(...ys));
  const [x0, x1] = [xt[0], xt[xt.length - 1]];
  const [y0, y1] = [yt[0], yt[yt.length - 1]];
  const left = box.x + 46;
  const right = box.x + box.width - 8;
  const top = box.y + 16;
  const bottom = box.y + box.height - 30;
  const px = (x: number) => left + ((x - x0) / (x1 - x0 || 1)) * (right - left);
  const py = (y: number) => bottom - ((y - y0) / (y1 - y0 || 1)) * (bottom - top);

  doc.save();
  doc.font('Helvetica-Bold').fontSize(9).fillColor(INK).text(title, box.x, box.y, { width: box.width, lineBreak: false });
  doc.font('Helvetica').fontSize(7);
  for (const t of yt) {
    doc.moveTo(left, py(t)).lineTo(right, py(t)).lineWidth(0.4).strokeColor(HAIRLINE).stroke();
    doc.fillColor(FAINT).text(tickLabel(t, yt), box.x, py(t) - 3, { width: 42, align: 'right', lineBreak: false });
  }
  for (const t of xt) {
    doc.moveTo(px(t), bottom).lineTo(px(t), bottom + 3).lineWidth(0.6).strokeColor(INK).stroke();
    doc.fillColor(FAINT).text(tickLabel(t, xt), px(t) - 20, bottom + 5, { width: 40, align: 'center', lineBreak: false });
  }
  doc.rect(left, top, right - left, bottom - top).lineWidth(0.6).strokeColor(INK).stroke();
  doc.fillColor(INK).text(xLabel, left, bottom + 15, { width: right - left, align: 'center', lineBreak: false });
  doc.save().rotate(-90, { origin: [box.x + 6, (top + bottom) / 2] });
  doc.text(yLabel, box.x + 6 - 60, (top + bottom) / 2 - 3, { width: 120, align: 'center', lineBreak: false });
  doc.restore();

  // Clip to the plot area so nothing spills over the axes.
  doc.save();
  doc.rect(left, top, right - left, bottom - top).clip();
  for (const s of series) {
    const pts = s.points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y));
    if (pts.length === 0) continue;
    if (s.style === 'points') {
      for (const p of pts) doc.circle(px(p.x), py(p.y), 1.6).lineWidth(0.6).strokeColor(s.color).stroke();
      continue;
    }
    doc.moveTo(px(pts[0].x), py(pts[0].y));
    for (const p of pts.slice(1)) doc.lineTo(px(p.x), py(p.y));
    doc.lineWidth(1.1).strokeColor(s.color);
    if (s.style === 'dashed') doc.dash(4, { space: 3 });
    doc.stroke();
    doc.undash();
  }
  doc.restore();

  // Legend under the title, right-aligned.
  let lx = right;
  doc.fontSize(7);
  for (const s of [...series].reverse()) {
    const w = doc.widthOfString(s.label);
    lx -= w + 22;
    const ly = box.y + 4;
    if (s.style === 'points') doc.circle(lx + 6, ly, 1.6).lineWidth(0.6).strokeColor(s.color).stroke();
    else {
      doc.moveTo(lx, ly).lineTo(lx + 12, ly).lineWidth(1.1).strokeColor(s.color);
      if (s.style === 'dashed') doc.dash(3, { space: 2 });
      doc.stroke();
      doc.undash();
    }
    doc.fillColor(INK).text(s.label, lx + 15, ly - 3, { lineBreak: false });
  }
  doc.restore();
}
