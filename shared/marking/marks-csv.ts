// Marks as CSV, the one module for both readers:
//  - the marks API's files: `frame,u_px,v_px` (frame pixels) or `t_s,x_m,y_m`
//    (world), exactly those columns. The header line is required so a file in
//    the wrong kind is caught, not silently misread. Errors name the line
//    (1 = header) so a person can fix the file; all of them are collected.
//  - the fit command's file (parseFitMarksCsv): `t_s,x_m,y_m` with an optional
//    `sigma_m`, columns in any order, extra columns ignored; the first error stops it.
import type { FitMark } from '../physics/types';
import { FitInputError, validateMarks } from '../physics/validate-marks';
import { MARKS_CSV_HEADERS, type CsvLineError, type MarksCsvKind } from '../schemas/marking';

export type { CsvLineError };

export interface PixelCsvRow {
  frame: number;
  uPx: number;
  vPx: number;
}

export interface WorldCsvRow {
  tS: number;
  xM: number;
  yM: number;
}

/** Stop listing after this many; a wholly wrong file would otherwise produce one error per line. */
const MAX_ERRORS = 20;
/** Plain decimal or exponent numbers only: Number('') is 0 and Number('0x10') is 16. */
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

function splitLines(text: string): string[] {
  return text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
}

/** `lines[i]` is the file line (1 = header) of `rows[i]`, for errors found after parsing. */
export type ParseResult<Row> = { ok: true; rows: Row[]; lines: number[] } | { ok: false; errors: CsvLineError[] };

export function parseMarksCsv(text: string, kind: 'pixel'): ParseResult<PixelCsvRow>;
export function parseMarksCsv(text: string, kind: 'world'): ParseResult<WorldCsvRow>;
export function parseMarksCsv(text: string, kind: MarksCsvKind): ParseResult<PixelCsvRow | WorldCsvRow>;
export function parseMarksCsv(text: string, kind: MarksCsvKind): ParseResult<PixelCsvRow | WorldCsvRow> {
  const columns = MARKS_CSV_HEADERS[kind];
  const lines = splitLines(text);
  const errors: CsvLineError[] = [];
  const headerIndex = lines.findIndex((l) => l.trim() !== '');
  if (headerIndex < 0) return { ok: false, errors: [{ line: 1, message: `the file is empty; expected the header ${columns.join(',')}` }] };
  const header = lines[headerIndex].split(',').map((c) => c.trim().toLowerCase());
  if (header.length !== 3 || header.some((c, i) => c !== columns[i])) {
    const other: MarksCsvKind = kind === 'pixel' ? 'world' : 'pixel';
    const hint = header.join(',') === MARKS_CSV_HEADERS[other].join(',') ? ` (this is a ${other} file)` : '';
    return { ok: false, errors: [{ line: headerIndex + 1, message: `header must be ${columns.join(',')}, found "${lines[headerIndex].trim()}"${hint}` }] };
  }

  const rows: (PixelCsvRow | WorldCsvRow)[] = [];
  const rowLines: number[] = [];
  const seen = new Map<number, number>();
  for (let index = headerIndex + 1; index < lines.length && errors.length < MAX_ERRORS; index++) {
    const raw = lines[index].trim();
    if (raw === '') continue;
    const line = index + 1;
    const cells = raw.split(',').map((c) => c.trim());
    if (cells.length !== 3) {
      errors.push({ line, message: `expected 3 values (${columns.join(',')}), found ${cells.length}` });
      continue;
    }
    const values: number[] = [];
    let bad = false;
    cells.forEach((cell, i) => {
      const value = NUMBER.test(cell) ? Number(cell) : NaN;
      if (!Number.isFinite(value)) {
        errors.push({ line, message: `${columns[i]} "${cell}" is not a number` });
        bad = true;
      }
      values.push(value);
    });
    if (bad) continue;
    const key = values[0];
    if (kind === 'pixel' && !(Number.isInteger(key) && key >= 0)) {
      errors.push({ line, message: `frame "${cells[0]}" must be a whole number, 0 or more` });
      continue;
    }
    if (kind === 'world' && key < 0) {
      errors.push({ line, message: `t_s "${cells[0]}" must be 0 or more` });
      continue;
    }
    const previous = seen.get(key);
    if (previous !== undefined) {
      errors.push({ line, message: `${columns[0]} ${cells[0]} already given on line ${previous}` });
      continue;
    }
    seen.set(key, line);
    rowLines.push(line);
    rows.push(kind === 'pixel' ? { frame: key, uPx: values[1], vPx: values[2] } : { tS: key, xM: values[1], yM: values[2] });
  }
  if (errors.length) return { ok: false, errors };
  if (rows.length === 0) return { ok: false, errors: [{ line: headerIndex + 1, message: 'the file has a header but no marks' }] };
  return { ok: true, rows, lines: rowLines };
}

/** One error line per problem, for a problem document's detail. */
export function describeCsvErrors(errors: CsvLineError[]): string {
  const shown = errors.slice(0, 5).map((e) => `line ${e.line}: ${e.message}`);
  return shown.join('; ') + (errors.length > 5 ? `; and ${errors.length - 5} more` : '');
}

export function formatMarksCsv(rows: PixelCsvRow[], kind: 'pixel'): string;
export function formatMarksCsv(rows: WorldCsvRow[], kind: 'world'): string;
export function formatMarksCsv(rows: PixelCsvRow[] | WorldCsvRow[], kind: MarksCsvKind): string {
  const out = [MARKS_CSV_HEADERS[kind].join(',')];
  if (kind === 'pixel') {
    for (const r of rows as PixelCsvRow[]) out.push(`${r.frame},${r.uPx.toFixed(3)},${r.vPx.toFixed(3)}`);
  } else {
    // 1 ns and 1 µm: far below what a frame or a pixel can resolve, so nothing is lost in the file.
    for (const r of rows as WorldCsvRow[]) out.push(`${r.tS.toFixed(9)},${r.xM.toFixed(6)},${r.yM.toFixed(6)}`);
  }
  return out.join('\n') + '\n';
}

/** The fit command's marks.csv → marks, checked as fitShot would; throws FitInputError naming the line. */
export function parseFitMarksCsv(text: string): FitMark[] {
  const lines = splitLines(text);
  const headerIndex = lines.findIndex((l) => l.trim() !== '');
  if (headerIndex < 0) throw new FitInputError('marks CSV is empty');
  const header = lines[headerIndex].split(',').map((h) => h.trim().toLowerCase());
  for (const col of MARKS_CSV_HEADERS.world) {
    if (!header.includes(col)) throw new FitInputError(`marks CSV is missing the ${col} column (header: ${header.join(',')})`);
  }
  const idx = { t: header.indexOf('t_s'), x: header.indexOf('x_m'), y: header.indexOf('y_m'), s: header.indexOf('sigma_m') };
  const number = (text: string, column: string, lineNo: number): number => {
    const s = text.trim();
    if (!NUMBER.test(s)) throw new FitInputError(`line ${lineNo}: ${column} is not a number (${JSON.stringify(s)})`);
    return Number(s);
  };
  const marks: FitMark[] = [];
  for (let i = headerIndex + 1; i < lines.length; i++) {
    if (lines[i].trim() === '') continue;
    const lineNo = i + 1;
    const cells = lines[i].split(',');
    if (cells.length !== header.length) {
      throw new FitInputError(`line ${lineNo}: expected ${header.length} fields, found ${cells.length}`);
    }
    const mark: FitMark = { tS: number(cells[idx.t], 't_s', lineNo), xM: number(cells[idx.x], 'x_m', lineNo), yM: number(cells[idx.y], 'y_m', lineNo) };
    if (idx.s >= 0) mark.sigmaM = number(cells[idx.s], 'sigma_m', lineNo);
    marks.push(mark);
  }
  validateMarks(marks);
  return marks;
}
