// Marks as CSV: `frame,u_px,v_px` (frame pixels) or `t_s,x_m,y_m` (world).
// The header line is required so a file in the wrong kind is caught, not
// silently misread. Errors name the line (1 = header) so a person can fix the file.

export type MarksCsvKind = 'pixel' | 'world';

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

export interface CsvLineError {
  line: number;
  message: string;
}

export const MARKS_CSV_COLUMNS: Record<MarksCsvKind, readonly [string, string, string]> = {
  pixel: ['frame', 'u_px', 'v_px'],
  world: ['t_s', 'x_m', 'y_m'],
};

/** Stop listing after this many; a wholly wrong file would otherwise produce one error per line. */
const MAX_ERRORS = 20;
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** `lines[i]` is the file line (1 = header) of `rows[i]`, for errors found after parsing. */
export type ParseResult<Row> = { ok: true; rows: Row[]; lines: number[] } | { ok: false; errors: CsvLineError[] };

export function parseMarksCsv(text: string, kind: 'pixel'): ParseResult<PixelCsvRow>;
export function parseMarksCsv(text: string, kind: 'world'): ParseResult<WorldCsvRow>;
export function parseMarksCsv(text: string, kind: MarksCsvKind): ParseResult<PixelCsvRow | WorldCsvRow>;
export function parseMarksCsv(text: string, kind: MarksCsvKind): ParseResult<PixelCsvRow | WorldCsvRow> {
  const columns = MARKS_CSV_COLUMNS[kind];
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const errors: CsvLineError[] = [];
  const headerIndex = lines.findIndex((l) => l.trim() !== '');
  if (headerIndex < 0) return { ok: false, errors: [{ line: 1, message: `the file is empty; expected the header ${columns.join(',')}` }] };
  const header = lines[headerIndex].split(',').map((c) => c.trim().toLowerCase());
  if (header.length !== 3 || header.some((c, i) => c !== columns[i])) {
    const other: MarksCsvKind = kind === 'pixel' ? 'world' : 'pixel';
    const hint = header.join(',') === MARKS_CSV_COLUMNS[other].join(',') ? ` (this is a ${other} file)` : '';
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
  const out = [MARKS_CSV_COLUMNS[kind].join(',')];
  if (kind === 'pixel') {
    for (const r of rows as PixelCsvRow[]) out.push(`${r.frame},${r.uPx.toFixed(3)},${r.vPx.toFixed(3)}`);
  } else {
    // 1 ns and 1 µm: far below what a frame or a pixel can resolve, so nothing is lost in the file.
    for (const r of rows as WorldCsvRow[]) out.push(`${r.tS.toFixed(9)},${r.xM.toFixed(6)},${r.yM.toFixed(6)}`);
  }
  return out.join('\n') + '\n';
}
