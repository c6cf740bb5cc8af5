// Bundle sizes for `npm run bench`: bytes of JavaScript per route chunk, as built and
// as sent (the brotli and gzip twins the server hands out), and the first load of the
// sign-in page (entry, its static imports and the page's chunk) against its budget.
// Usage: node scripts/bench-bundle.mjs <client dist>
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

const SIGN_IN_BUDGET_BYTES = 250 * 1024; // issue 14: at most 250 KB of JavaScript, compressed
const dist = process.argv[2] ?? process.env.CLIENT_DIST ?? 'dist';
const assets = path.join(dist, 'assets');
const size = (file) => (existsSync(file) ? statSync(file).size : null);
const sizes = (name) => {
  const file = path.join(assets, name);
  const raw = size(file);
  // Files under the plugin's 1 KiB threshold are sent as they are.
  return { raw, br: size(`${file}.br`) ?? raw, gz: size(`${file}.gz`) ?? raw };
};
const STATIC_IMPORT = /(?:^|[;}\s])(?:import|export)\s*(?:[\w$*{}\s,]*?from\s*)?["']\.\/([^"']+\.js)["']/g;

/** A chunk and everything it imports statically (what the browser must fetch before running it). */
function closure(start) {
  const seen = new Set();
  const todo = [...start];
  while (todo.length) {
    const name = todo.pop();
    if (seen.has(name)) continue;
    seen.add(name);
    const text = readFileSync(path.join(assets, name), 'utf8');
    for (const m of text.matchAll(STATIC_IMPORT)) todo.push(m[1]);
  }
  return [...seen];
}
const total = (names) => names.map(sizes).reduce((a, s) => ({ raw: a.raw + s.raw, br: a.br + s.br, gz: a.gz + s.gz }), { raw: 0, br: 0, gz: 0 });
const kb = (n) => `${(n / 1024).toFixed(1)} KB`;
const row = (label, s) => `  ${label.padEnd(34)} ${kb(s.raw).padStart(10)} ${kb(s.br).padStart(10)} ${kb(s.gz).padStart(10)}`;

const html = readFileSync(path.join(dist, 'index.html'), 'utf8');
const entry = [...html.matchAll(/(?:src|href)="\/assets\/([^"]+\.js)"/g)].map((m) => m[1]);
const js = readdirSync(assets).filter((f) => f.endsWith('.js'));
const page = (stem) => js.find((f) => f.startsWith(`${stem}-`));
const entryClosure = closure(entry);

console.log(`\nJavaScript per route chunk (uncompressed, brotli, gzip):`);
console.log(`  ${'chunk'.padEnd(34)} ${'raw'.padStart(10)} ${'brotli'.padStart(10)} ${'gzip'.padStart(10)}`);
console.log(row('entry (with its static imports)', total(entryClosure)));
for (const f of js.filter((f) => /-page-/.test(f) && !f.startsWith('workspace-page-')).sort()) {
  const own = closure([f]).filter((c) => !entryClosure.includes(c));
  console.log(row(f.replace(/-[\w-]{8}\.js$/, ''), total(own)));
}
const workspace = page('workspace-page');
if (workspace) {
  const own = closure([workspace]).filter((c) => !entryClosure.includes(c));
  console.log(`\nWorkspace route (beyond the entry): ${own.length} chunks`);
  console.log(row('workspace-page (all its chunks)', total(own)));
}
const signIn = page('sign-in-page');
const firstLoad = total(closure([...entry, signIn]));
const ok = firstLoad.br <= SIGN_IN_BUDGET_BYTES && firstLoad.gz <= SIGN_IN_BUDGET_BYTES;
console.log(`\nSign-in first load: ${kb(firstLoad.raw)} uncompressed, ${kb(firstLoad.br)} brotli, ${kb(firstLoad.gz)} gzip; budget ${kb(SIGN_IN_BUDGET_BYTES)} compressed: ${ok ? 'within' : 'OVER'} (${(firstLoad.gz / SIGN_IN_BUDGET_BYTES).toFixed(2)} of budget, gzip)`);
process.exitCode = ok ? 0 : 1;
