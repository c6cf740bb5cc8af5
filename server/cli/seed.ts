// `tsx server/cli/seed.ts`: migrate and seed the demo team (used by npm start and npm test).
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
  await seedDemo(database.db, DEMO_STEPS);
} finally {
  await database.close();
}
