// marks.csv -> marks. Header t_s,x_m,y_m with optional sigma_m; columns may
// come in any order, extra columns are ignored. Errors are one line each.
import type { FitMark } from './types';
import { FitInputError, validateMarks } from './validate-marks';

const REQUIRED = ['t_s', 'x_m', 'y_m'] as const;

function parseNumber(text: string, column: string, lineNo: number): number {
  const s = text.trim();
  // Number('') is 0 and Number('0x10') is 16: accept plain decimal/exponent numbers only.
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s)) {
    throw new FitInputError(`line ${lineNo}: ${column} is not a number (${JSON.stringify(s)})`);
  }
  return Number(s);
}

export function parseMarksCsv(text: string): FitMark[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const headerIndex = lines.findIndex((l) => l.trim() !== '');
  if (headerIndex < 0) throw new FitInputError('marks CSV is empty');
  const header = lines[headerIndex].split(',').map((h) => h.trim().toLowerCase());
  for (const col of REQUIRED) {
    if (!header.includes(col)) throw new FitInputError(`marks CSV is missing the ${col} column (header: ${header.join(',')})`);
  }
  const idx = { t: header.indexOf('t_s'), x: header.indexOf('x_m'), y: header.indexOf('y_m'), s: header.indexOf('sigma_m') };
  const marks: FitMark[] = [];
  for (let i = headerIndex + 1; i < lines.length; i++) {
    if (lines[i].trim() === '') continue;
    const lineNo = i + 1;
    const cells = lines[i].split(',');
    if (cells.length !== header.length) {
      throw new FitInputError(`line ${lineNo}: expected ${header.length} fields, found ${cells.length}`);
    }
    const mark: FitMark = {
      tS: parseNumber(cells[idx.t], 't_s', lineNo),
      xM: parseNumber(cells[idx.x], 'x_m', lineNo),
      yM: parseNumber(cells[idx.y], 'y_m', lineNo),
    };
    if (idx.s >= 0) mark.sigmaM = parseNumber(cells[idx.s], 'sigma_m', lineNo);
    marks.push(mark);
  }
  validateMarks(marks);
  return marks;
}
