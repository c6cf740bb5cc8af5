import { describe, expect, it } from 'vitest';
import { formatMarksCsv, parseMarksCsv } from './marks-csv';

describe('marks CSV', () => {
  it('parses pixel files with CRLF, a BOM, spaces and blank lines', () => {
    const r = parseMarksCsv('\uFEFFframe, u_px ,v_px\r\n0,10.5,20\r\n\r\n 3 , 11.25 , -2e1\r\n', 'pixel');
    expect(r).toEqual({ ok: true, rows: [{ frame: 0, uPx: 10.5, vPx: 20 }, { frame: 3, uPx: 11.25, vPx: -20 }], lines: [2, 4] });
  });

  it('round-trips pixel and world rows through format → parse', () => {
    const pixel = [{ frame: 4, uPx: 101.125, vPx: 33.5 }, { frame: 5, uPx: 110, vPx: 30.875 }];
    expect(parseMarksCsv(formatMarksCsv(pixel, 'pixel'), 'pixel')).toMatchObject({ ok: true, rows: pixel });
    const world = [{ tS: 0.004, xM: 0.123456, yM: 1.5 }, { tS: 0.008, xM: 0.25, yM: 1.498 }];
    expect(parseMarksCsv(formatMarksCsv(world, 'world'), 'world')).toMatchObject({ ok: true, rows: world });
  });

  it('names the line of each bad value and stores nothing', () => {
    const r = parseMarksCsv('frame,u_px,v_px\n1,2,3\n2,abc,3\n2.5,1,1\n4,1\n1,5,5\n', 'pixel');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors).toEqual([
      { line: 3, message: 'u_px "abc" is not a number' },
      { line: 4, message: 'frame "2.5" must be a whole number, 0 or more' },
      { line: 5, message: 'expected 3 values (frame,u_px,v_px), found 2' },
      { line: 6, message: 'frame 1 already given on line 2' },
    ]);
  });

  it('requires the header and says when the file is of the other kind', () => {
    const missing = parseMarksCsv('1,2,3\n', 'pixel');
    expect(missing.ok === false && missing.errors[0]).toMatchObject({ line: 1, message: expect.stringMatching(/header must be frame,u_px,v_px/) });
    const other = parseMarksCsv('t_s,x_m,y_m\n0,1,1\n', 'pixel');
    expect(other.ok === false && other.errors[0].message).toMatch(/this is a world file/);
    expect(parseMarksCsv('', 'world').ok).toBe(false);
    expect(parseMarksCsv('t_s,x_m,y_m\n', 'world').ok).toBe(false);
  });

  it('rejects Infinity, hex and empty cells', () => {
    const r = parseMarksCsv('t_s,x_m,y_m\nInfinity,1,1\n0x10,1,1\n0.1,,1\n', 'world');
    expect(r.ok === false && r.errors.map((e) => e.line)).toEqual([2, 3, 4]);
  });
});
