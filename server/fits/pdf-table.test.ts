// The table helper read back by an independent PDF reader (pdf-parse, on Mozilla's pdf.js):
// a table longer than a page carries its column headers on every page, and every page is numbered.
import PDFDocument from 'pdfkit';
import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { drawTable, numberPages } from './pdf-table';

async function render(draw: (doc: InstanceType<typeof PDFDocument>) => void): Promise<{ pages: string[] }> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, bufferPages: true });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  draw(doc);
  numberPages(doc);
  doc.end();
  const parser = new PDFParse({ data: new Uint8Array(await done) });
  const result = await parser.getText();
  await parser.destroy();
  return { pages: result.pages.map((p: { text: string }) => p.text.replace(/\s+/g, ' ')) };
}

describe('PDF tables', () => {
  it('repeat their column headers on every page they run onto, and every page is numbered', async () => {
    const rows = Array.from({ length: 150 }, (_, i) => [`row ${i + 1}`, (i * 0.01).toFixed(2), (i * 0.5).toFixed(1)]);
    const { pages } = await render((doc) => drawTable(doc, { headers: ['Mark', 'Time (s)', 'Height (m)'], widths: [100, 100, 100], rows, numeric: [1, 2] }));
    expect(pages.length).toBeGreaterThanOrEqual(3);
    pages.forEach((text, i) => {
      expect(text).toContain('Mark Time (s) Height (m)');
      expect(text).toContain(`Page ${i + 1} of ${pages.length}`);
    });
    // Nothing lost or doubled at the breaks.
    const all = pages.join(' ');
    for (const n of [1, 57, 58, 150]) expect(all.match(new RegExp(`row ${n} `, 'g'))).toHaveLength(1);
    // Rendering and reading back three pages is slow on a loaded machine; no timing is asserted.
  }, 60_000);

  it('moves a table whose header would sit alone at the foot of a page to the next page', async () => {
    const { pages } = await render((doc) => {
      doc.y = doc.page.height - doc.page.margins.bottom - 12;
      drawTable(doc, { headers: ['Quantity', 'Value'], widths: [150, 150], rows: [['Launch speed', '23.4 m/s']] });
    });
    expect(pages).toHaveLength(2);
    expect(pages[0]).not.toContain('Quantity');
    expect(pages[1]).toContain('Quantity Value Launch speed');
  });
});
