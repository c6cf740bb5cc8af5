// Reader for the NIST StRD nonlinear regression files (National Institute of
// Standards and Technology, Statistical Reference Datasets, Nonlinear
// Regression). The files are vendored in fixtures/nist-strd (public-domain US
// government data; fixtures/nist-strd/README.md names the source).
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository root: the nearest folder above this file holding package.json (so the reader survives a move). */
function findRepoRoot(from: string): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json'))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`no package.json above ${from}`);
  }
}

export const NIST_STRD_DIR = path.join(findRepoRoot(path.dirname(fileURLToPath(import.meta.url))), 'fixtures', 'nist-strd');

/** model(b, x) where x holds the predictor(s) of one observation. */
type Model = (b: Float64Array, x: number[]) => number;

// The 27 model formulas, keyed by the formula text as printed in each file's
// "Model:" block (whitespace removed, [] read as ()). A file whose formula is
// not in this table fails the test rather than being skipped.
const MODELS: Record<string, Model> = {
  'y=b1*(b2+x)**(-1/b3)': (b, [x]) => b[0] * Math.pow(b[1] + x, -1 / b[2]),
  'y=b1*(1-exp(-b2*x))': (b, [x]) => b[0] * (1 - Math.exp(-b[1] * x)),
  'y=exp(-b1*x)/(b2+b3*x)': (b, [x]) => Math.exp(-b[0] * x) / (b[1] + b[2] * x),
  'y=b1*x**b2': (b, [x]) => b[0] * Math.pow(x, b[1]),
  'y=b1+b2*cos(2*pi*x/12)+b3*sin(2*pi*x/12)+b5*cos(2*pi*x/b4)+b6*sin(2*pi*x/b4)+b8*cos(2*pi*x/b7)+b9*sin(2*pi*x/b7)':
    (b, [x]) => {
      const w = 2 * Math.PI * x;
      return b[0] + b[1] * Math.cos(w / 12) + b[2] * Math.sin(w / 12) + b[4] * Math.cos(w / b[3]) +
        b[5] * Math.sin(w / b[3]) + b[7] * Math.cos(w / b[6]) + b[8] * Math.sin(w / b[6]);
    },
  'y=(b1/b2)*exp(-0.5*((x-b3)/b2)**2)': (b, [x]) => (b[0] / b[1]) * Math.exp(-0.5 * ((x - b[2]) / b[1]) ** 2),
  'y=b1*exp(-b2*x)+b3*exp(-(x-b4)**2/b5**2)+b6*exp(-(x-b7)**2/b8**2)': (b, [x]) =>
    b[0] * Math.exp(-b[1] * x) + b[2] * Math.exp(-((x - b[3]) ** 2) / b[4] ** 2) +
    b[5] * Math.exp(-((x - b[6]) ** 2) / b[7] ** 2),
  'y=(b1+b2*x+b3*x**2+b4*x**3)/(1+b5*x+b6*x**2+b7*x**3)': (b, [x]) =>
    (b[0] + x * (b[1] + x * (b[2] + x * b[3]))) / (1 + x * (b[4] + x * (b[5] + x * b[6]))),
  'y=(b1+b2*x+b3*x**2)/(1+b4*x+b5*x**2)': (b, [x]) => (b[0] + x * (b[1] + x * b[2])) / (1 + x * (b[3] + x * b[4])),
  'y=b1*exp(-b2*x)+b3*exp(-b4*x)+b5*exp(-b6*x)': (b, [x]) =>
    b[0] * Math.exp(-b[1] * x) + b[2] * Math.exp(-b[3] * x) + b[4] * Math.exp(-b[5] * x),
  'y=b1*(x**2+x*b2)/(x**2+x*b3+b4)': (b, [x]) => (b[0] * (x * x + x * b[1])) / (x * x + x * b[2] + b[3]),
  'y=b1*exp(b2/(x+b3))': (b, [x]) => b[0] * Math.exp(b[1] / (x + b[2])),
  'y=b1+b2*exp(-x*b4)+b3*exp(-x*b5)': (b, [x]) => b[0] + b[1] * Math.exp(-x * b[3]) + b[2] * Math.exp(-x * b[4]),
  'y=b1*(1-(1+b2*x/2)**(-2))': (b, [x]) => b[0] * (1 - Math.pow(1 + (b[1] * x) / 2, -2)),
  'y=b1*(1-(1+2*b2*x)**(-.5))': (b, [x]) => b[0] * (1 - Math.pow(1 + 2 * b[1] * x, -0.5)),
  'y=b1*b2*x*((1+b2*x)**(-1))': (b, [x]) => (b[0] * b[1] * x) / (1 + b[1] * x),
  // Nelson models log(y); the response column is transformed when read.
  'log(y)=b1-b2*x1*exp(-b3*x2)': (b, [x1, x2]) => b[0] - b[1] * x1 * Math.exp(-b[2] * x2),
  'y=b1/(1+exp(b2-b3*x))': (b, [x]) => b[0] / (1 + Math.exp(b[1] - b[2] * x)),
  'y=b1/((1+exp(b2-b3*x))**(1/b4))': (b, [x]) => b[0] / Math.pow(1 + Math.exp(b[1] - b[2] * x), 1 / b[3]),
  'y=b1-b2*x-arctan(b3/(x-b4))/pi': (b, [x]) => b[0] - b[1] * x - Math.atan(b[2] / (x - b[3])) / Math.PI,
};

export interface NistDataset {
  name: string;
  difficulty: 'Lower' | 'Average' | 'Higher';
  formula: string;
  model: Model;
  start1: number[];
  start2: number[];
  certified: number[];
  certifiedStdDev: number[];
  certifiedRss: number;
  x: number[][];
  y: number[];
}

export function nistAvailable(): boolean {
  return fs.existsSync(NIST_STRD_DIR) && fs.readdirSync(NIST_STRD_DIR).some((f) => f.endsWith('.dat'));
}

export function listNistFiles(): string[] {
  return fs.readdirSync(NIST_STRD_DIR).filter((f) => f.endsWith('.dat')).sort();
}

export function readNistDataset(file: string): NistDataset {
  const lines = fs.readFileSync(path.join(NIST_STRD_DIR, file), 'utf8').split(/\r?\n/);
  const name = file.replace(/\.dat$/, '');
  const ranges = (label: RegExp) => {
    const line = lines.find((l) => label.test(l));
    const m = line?.match(/lines\s+(\d+)\s+to\s+(\d+)/);
    if (!m) throw new Error(`${file}: no "${label}" line range`);
    return [Number(m[1]), Number(m[2])] as const;
  };
  const [startA, startB] = ranges(/^\s*Starting Values\s+\(lines/);
  const [dataA, dataB] = ranges(/^\s*Data\s+\(lines/);
  const difficulty = (['Lower', 'Average', 'Higher'] as const).find((d) =>
    lines.some((l) => l.includes(`${d} Level of Difficulty`)),
  );
  if (!difficulty) throw new Error(`${file}: no difficulty`);

  const modelAt = lines.findIndex((l) => l.trim().startsWith('Model:'));
  const startsAt = lines.findIndex((l, i) => i > modelAt && /Starting values/i.test(l));
  const formula = lines
    .slice(modelAt + 1, startsAt)
    .map((l) => l.trim())
    .filter((l) => l && !/^\d+ Parameters/.test(l) && !/^pi\s*=/.test(l))
    .join('')
    .replace(/\s+/g, '')
    .replace(/\[/g, '(')
    .replace(/\]/g, ')')
    .replace(/\+e$/, '');
  const model = MODELS[formula];
  if (!model) throw new Error(`${file}: model "${formula}" not in the table`);

  const start1: number[] = [], start2: number[] = [], certified: number[] = [], certifiedStdDev: number[] = [];
  for (let ln = startA; ln <= startB; ln++) {
    const parts = lines[ln - 1].split('=')[1].trim().split(/\s+/).map(Number);
    start1.push(parts[0]); start2.push(parts[1]); certified.push(parts[2]); certifiedStdDev.push(parts[3]);
  }
  const rssLine = lines.find((l) => l.includes('Residual Sum of Squares'));
  const certifiedRss = Number(rssLine!.split(':')[1]);
  const x: number[][] = [], y: number[] = [];
  for (let ln = dataA; ln <= dataB; ln++) {
    const cols = lines[ln - 1].trim().split(/\s+/).map(Number);
    y.push(formula.startsWith('log(y)') ? Math.log(cols[0]) : cols[0]);
    x.push(cols.slice(1));
  }
  return { name, difficulty, formula, model, start1, start2, certified, certifiedStdDev, certifiedRss, x, y };
}

/** Log relative error: number of correct significant digits (capped at 15 for exact agreement). */
export function lre(estimate: number, certified: number): number {
  const rel = Math.abs(estimate - certified) / Math.abs(certified);
  return rel === 0 ? 15 : Math.min(15, -Math.log10(rel));
}
