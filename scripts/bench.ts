// Runs every scripts/bench-*.ts module's exported bench function in turn
// (optionally only those whose name contains an argument) and prints its report.
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

const dir = import.meta.dirname;
const only = process.argv.slice(2);
const files = readdirSync(dir)
  .filter((f) => /^bench-.+\.ts$/.test(f))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

let failed = false;
for (const file of files) {
  const mod = (await import(pathToFileURL(path.join(dir, file)).href)) as Record<string, unknown>;
  const fn = Object.entries(mod).find(([name, value]) => name.startsWith('bench') && typeof value === 'function')?.[1] as
    | (() => Promise<string>)
    | undefined;
  if (!fn) continue;
  process.stdout.write(`\n=== ${file.replace(/\.ts$/, '')} ===\n`);
  try {
    process.stdout.write(`${await fn()}\n`);
  } catch (err) {
    failed = true;
    process.stdout.write(`failed: ${(err as Error).stack ?? err}\n`);
  }
}
process.exit(failed ? 1 : 0);
