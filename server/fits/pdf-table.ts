// Tables and page furniture for pdfkit reports: a table whose column headers are
// printed above its first row and again at the top of every page it runs onto,
// and "Page n of N" in the footer of every page.
import type PDFDocument from 'pdfkit';

type Doc = InstanceType<typeof PDFDocument>;

const INK = '#1b2433';
const SECONDARY = '#3d4a5c';
const HAIRLINE = '#e2dccf';

export interface PdfTable {
  headers: string[];
  widths: number[];
  rows: string[][];
  /** Columns printed right-aligned (numbers), by index. */
  numeric?: number[];
}

const bottomOf = (doc: Doc) => doc.page.height - doc.page.margins.bottom;

function cellsHeight(doc: Doc, cells: string[], widths: number[]): number {
  return Math.max(...cells.map((c, i) => doc.heightOfString(c || ' ', { width: widths[i] - 6 })));
}

function drawCells(doc: Doc, cells: string[], widths: number[], numeric: number[], bold: boolean) {
  const x0 = doc.page.margins.left;
  doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(8.5).fillColor(bold ? SECONDARY : INK);
  const y = doc.y;
  const h = cellsHeight(doc, cells, widths);
  let x = x0;
  cells.forEach((c, i) => {
    doc.text(c, x, y, { width: widths[i] - 6, align: numeric.includes(i) ? 'right' : 'left', lineBreak: true });
    x += widths[i];
  });
  if (bold) {
    const total = widths.reduce((a, b) => a + b, 0);
    doc.moveTo(x0, y + h + 1).lineTo(x0 + total, y + h + 1).lineWidth(0.5).strokeColor(HAIRLINE).stroke();
  }
  doc.x = x0;
  doc.y = y + h + 3;
}

/** Draws the table from doc.y; a row that would cross the bottom margin starts a new page under a repeated header. */
export function drawTable(doc: Doc, table: PdfTable) {
  const numeric = table.numeric ?? [];
  doc.font('Helvetica-Bold').fontSize(8.5);
  const headerH = cellsHeight(doc, table.headers, table.widths) + 3;
  doc.font('Helvetica').fontSize(8.5);
  const firstH = table.rows.length ? cellsHeight(doc, table.rows[0], table.widths) + 3 : 0;
  // Never leave a header alone at the foot of a page.
  if (doc.y + headerH + firstH > bottomOf(doc)) doc.addPage();
  drawCells(doc, table.headers, table.widths, numeric, true);
  for (const r of table.rows) {
    doc.font('Helvetica').fontSize(8.5);
    if (doc.y + cellsHeight(doc, r, table.widths) + 3 > bottomOf(doc)) {
      doc.addPage();
      drawCells(doc, table.headers, table.widths, numeric, true);
    }
    drawCells(doc, r, table.widths, numeric, false);
  }
  doc.font('Helvetica').fontSize(9).fillColor(INK);
}

/** "Page n of N" at the foot of every page; needs a document made with bufferPages: true, before doc.end(). */
export function numberPages(doc: Doc) {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // Writing below the bottom margin would make pdfkit add a page; lift the margin while the footer is written.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('Helvetica').fontSize(8).fillColor(SECONDARY);
    doc.text(`Page ${i - range.start + 1} of ${range.count}`, doc.page.margins.left, doc.page.height - bottom / 2 - 4, {
      width: doc.page.width - doc.page.margins.left - doc.page.margins.right,
      align: 'center',
      lineBreak: false,
    });
    doc.page.margins.bottom = bottom;
  }
}
