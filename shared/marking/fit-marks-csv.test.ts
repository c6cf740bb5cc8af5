import { describe, expect, it } from 'vitest';
import { parseFitMarksCsv } from './marks-csv';
import { airDensityFor, parseFitArgs, runFitCli } from '../physics/fit-cli';
import { FitInputError } from '../physics/validate-marks';

const rows = (n: number) => Array.from({ length: n }, (_, i) => `${(i / 240).toFixed(6)},${(0.1 * i).toFixed(4)},${(1 + 0.05 * i).toFixed(4)}`);

describe('marks CSV', () => {
  it('reads t_s,x_m,y_m with CRLF, a BOM, blank lines and columns in any order', () => {
    const text = '\uFEFFy_m,t_s,x_m,note\r\n1.0,0.0,0.0,a\r\n\r\n1.1,0.01,0.2,b\r\n1.2,0.02,0.4,c\r\n1.3,0.03,0.6,d\r\n1.4,0.04,0.8,e\r\n';
    const marks = parseFitMarksCsv(text);
    expect(marks).toHaveLength(5);
    expect(marks[1]).toEqual({ tS: 0.01, xM: 0.2, yM: 1.1 });
  });

  it('reads an optional sigma_m column', () => {
    const text = ['t_s,x_m,y_m,sigma_m', ...rows(6).map((r) => `${r},0.002`)].join('\n');
    expect(parseFitMarksCsv(text)[0].sigmaM).toBe(0.002);
  });

  it.each([
    ['missing column', 't_s,x_m\n0,0\n', /missing the y_m column/],
    ['non-number', ['t_s,x_m,y_m', ...rows(5), '0.9,abc,1'].join('\n'), /line 7: x_m is not a number/],
    ['empty cell', ['t_s,x_m,y_m', ...rows(5), '0.9,,1'].join('\n'), /x_m is not a number/],
    ['hex is not a number', ['t_s,x_m,y_m', ...rows(5), '0.9,0x10,1'].join('\n'), /x_m is not a number/],
    ['fewer points than parameters', ['t_s,x_m,y_m', ...rows(4)].join('\n'), /at least 5 marks/],
    ['non-increasing time', ['t_s,x_m,y_m', ...rows(5), '0.0,1,1'].join('\n'), /not after the previous mark/],
    ['ragged row', ['t_s,x_m,y_m', ...rows(5), '1,2'].join('\n'), /expected 3 fields/],
    ['empty file', '', /empty/],
  ])('rejects %s', (_label, text, message) => {
    expect(() => parseFitMarksCsv(text)).toThrow(FitInputError);
    expect(() => parseFitMarksCsv(text)).toThrow(message);
  });
});

describe('fit CLI arguments', () => {
  it('parses the documented options in both --flag value and --flag=value forms', () => {
    const o = parseFitArgs(['m.csv', '--mass-kg', '0.058', '--diameter-m=0.065', '--temp-c', '20', '--pressure-hpa', '1013.25', '--rh', '50', '--muzzle-x-m', '0', '--muzzle-y-m', '1']);
    expect(o).toEqual({
      csvPath: 'm.csv', massKg: 0.058, diameterM: 0.065,
      air: { kind: 'weather', temperatureC: 20, pressureHpa: 1013.25, rhPercent: 50 },
      muzzle: { xM: 0, yM: 1 },
    });
    // Humid-air density at 20 degC, 1013.25 hPa, 50 % RH is about 1.199 kg/m3 (CIPM-2007 tables, from memory).
    expect(airDensityFor(o)).toBeCloseTo(1.199, 3);
  });

  it.each([
    [['m.csv', '--diameter-m', '0.06'], /--mass-kg is required/],
    [['m.csv', '--mass-kg', 'heavy', '--diameter-m', '0.06'], /--mass-kg must be a number/],
    [['m.csv', '--mass-kg', '1', '--diameter-m', '0.06', '--rh', '50'], /must be given together/],
    [['m.csv', '--mass-kg', '1', '--diameter-m', '0.06', '--air-density-kgm3', '1.2', '--temp-c', '20'], /not both/],
    [['m.csv', '--mass-kg', '1', '--diameter-m', '0.06', '--speed', '3'], /unknown option --speed/],
    [['--mass-kg', '1', '--diameter-m', '0.06'], /exactly one marks CSV/],
    [['m.csv', '--mass-kg', '1', '--diameter-m', '0.06', '--muzzle-x-m', '0'], /together/],
  ])('rejects %j', (argv, message) => {
    expect(() => parseFitArgs(argv as string[])).toThrow(message);
  });

  it('runFitCli reports a missing file as one line and exit code 2', () => {
    const out = runFitCli(['nope.csv', '--mass-kg', '1', '--diameter-m', '0.05'], () => {
      throw Object.assign(new Error('ENOENT: no such file'), { code: 'ENOENT' });
    });
    expect(out.exitCode).toBe(2);
    expect(out.stderr).toBe('fit: cannot read nope.csv (ENOENT)\n');
  });
});
