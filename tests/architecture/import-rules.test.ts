// The layering rules of DEVELOPERS.md, checked on every source file so they stay true:
// - a feature never imports another feature (features share through src/api, src/components, src/lib);
// - shared/ imports nothing from src/ or server/ (it runs on both sides);
// - route files import no table module (server/db/schema/*): routes call services, services query.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const repoRoot = path.resolve(import.meta.dirname, '../..');

function sourceFiles(dir: string): string[] {
  const abs = path.join(repoRoot, dir);
  if (!fs.existsSync(abs)) return [];
  return (fs.readdirSync(abs, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((e) => e.isFile() && /\.(ts|tsx|mts|mjs|js)$/.test(e.name))
    .map((e) => path.relative(repoRoot, path.join(e.parentPath, e.name)));
}

// Static imports, re-exports, side-effect imports, dynamic import() and vi.mock() paths.
const SPECIFIER = /(?:\bfrom\s*|\bimport\s*\(\s*|\bimport\s+|\bvi\.mock\(\s*)['"]([^'"]+)['"]/g;

/** The repository-relative path an import points at, or null for a package. */
function resolveImport(fromFile: string, spec: string): string | null {
  if (spec.startsWith('@/')) return path.join('src', spec.slice(2));
  if (spec.startsWith('@shared/')) return path.join('shared', spec.slice('@shared/'.length));
  if (spec.startsWith('.')) return path.normalize(path.join(path.dirname(fromFile), spec));
  return null;
}

function importsOf(fromFile: string, text: string): string[] {
  const targets: string[] = [];
  for (const m of text.matchAll(SPECIFIER)) {
    const target = resolveImport(fromFile, m[1]);
    if (target) targets.push(target);
  }
  return targets;
}

const featureOf = (file: string) => /^src\/features\/([^/]+)\//.exec(file)?.[1] ?? null;

type Rule = { name: string; files: string[]; broken: (from: string, to: string) => boolean };

const RULES: Rule[] = [
  {
    name: 'no feature imports another feature',
    files: ['src/features'],
    broken: (from, to) => {
      const a = featureOf(from);
      const b = featureOf(to.endsWith('/') ? to : `${to}/`) ?? featureOf(to);
      return a !== null && b !== null && a !== b;
    },
  },
  {
    name: 'shared/ imports nothing from src/ or server/',
    files: ['shared'],
    broken: (_from, to) => /^(src|server)(\/|$)/.test(to),
  },
  {
    name: 'route files import no table module (server/db/schema/*)',
    files: ['server/routes'],
    broken: (_from, to) => /^server\/db\/schema(\/|$)/.test(to),
  },
];

function violations(rule: Rule, files: Array<{ file: string; text: string }>): string[] {
  const found: string[] = [];
  for (const { file, text } of files) {
    for (const to of importsOf(file, text)) if (rule.broken(file, to)) found.push(`${file} → ${to}`);
  }
  return found;
}

describe('import rules', () => {
  it('the checker catches each kind of break (so the rules below can fail)', () => {
    const cases: Array<[Rule, string, string]> = [
      [RULES[0], 'src/features/fits/components/fit-card.tsx', "import { X } from '../../presets/hooks/use-x';"],
      [RULES[0], 'src/features/fits/components/fit-card.tsx', "import { X } from '@/features/presets/components/y';"],
      [RULES[1], 'shared/physics/fit.ts', "import { db } from '../../server/db/client';"],
      [RULES[1], 'shared/physics/fit.ts', "const m = await import('@/lib/format');"],
      [RULES[2], 'server/routes/clips.ts', "import { clips } from '../db/schema/clips';"],
    ];
    for (const [rule, file, text] of cases) expect(violations(rule, [{ file, text }]), `${rule.name}: ${text}`).toHaveLength(1);
    // Allowed: a feature's own files, the API layer, packages.
    const fine = "import { a } from './b'; import { c } from '@/api/fits/get-fit'; import { z } from 'zod';";
    expect(violations(RULES[0], [{ file: 'src/features/fits/components/fit-card.tsx', text: fine }])).toEqual([]);
  });

  for (const rule of RULES) {
    it(rule.name, () => {
      const files = rule.files.flatMap(sourceFiles).map((file) => ({ file, text: fs.readFileSync(path.join(repoRoot, file), 'utf8') }));
      expect(files.length, `no source files under ${rule.files.join(', ')}`).toBeGreaterThan(0);
      expect(violations(rule, files)).toEqual([]);
    });
  }
});
