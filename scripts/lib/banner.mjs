// Printed once the server is up. The people mirror server/seed/demo-people.ts
// (kept in sync by tests/unit/banner.test.ts).
export const DEMO_SIGN_INS = [
  ['admin', 'maren.holt@ollendry.test'],
  ['analyst', 'tomas.reyes@ollendry.test'],
  ['tracker', 'ines.varga@ollendry.test'],
  ['engineer', 'dev.okafor@ollendry.test'],
  ['viewer', 'lou.brandt@ollendry.test'],
  ['engineer', 'sana.quist@ollendry.test'],
];
export const DEMO_PASSWORD = 'ollendry-demo-2026';

export function printSignIns(url) {
  const lines = [
    '',
    `  Arcbench is running at ${url}`,
    '',
    `  Demo sign-ins (team Ollendry Line Works; password for all: ${DEMO_PASSWORD} — demo only):`,
    ...DEMO_SIGN_INS.map(([role, email]) => `    ${role.padEnd(9)} ${email}`),
    '',
    '  Press Ctrl-C to stop the server and the database.',
    '',
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
}

/** Production mode: no demo accounts exist; say how to make the first admin. */
export function printProductionBanner(url) {
  const lines = [
    '',
    `  Arcbench is running at ${url} (production mode: no demo team)`,
    '',
    '  First time? Create the first admin in another terminal:  npm run admin:create',
    '  See README, "Running it for real", for TRUST_PROXY, SMTP_URL and backups.',
    '',
    '  Press Ctrl-C to stop the server and the database.',
    '',
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
}
