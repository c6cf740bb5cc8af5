// `tsx server/cli/seed.ts`: migrate and seed the demo team (used by npm start and npm test);
// in production mode it only migrates.
import { loadConfig } from '../config';
import { connect } from '../db/client';
import { applyMigrations, ensureDatabase } from '../db/migrate';
import { DEMO_STEPS } from '../seed/demo-steps';
import { seedDemo } from '../seed/seed-demo';

const config = loadConfig();
await ensureDatabase(config.databaseUrl);
const database = connect(config.databaseUrl, 2);
try {
  await applyMigrations(database.db);
  // Production mode (NODE_ENV=production or ARCBENCH_DEMO=off) never seeds the demo team and its published password.
  if (config.demo) await seedDemo(database.db, DEMO_STEPS);
  else process.stdout.write('[arcbench] Production mode: no demo team. Create the first admin with `npm run admin:create`.\n');
} finally {
  await database.close();
}
