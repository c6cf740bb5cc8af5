// `npm run worker`: the job worker as its own process, for scaling extraction
// out beside (or instead of) the server's in-process worker. Same database,
// same storage root, same queue.
import { loadConfig } from './config';
import { connect } from './db/client';
import { applyMigrations, ensureDatabase } from './db/migrate';
import { startJobQueue } from './jobs/queue';
import { localDiskStorage } from './storage/local-disk';

const config = loadConfig();
await ensureDatabase(config.databaseUrl);
const database = connect(config.databaseUrl, 4);
await applyMigrations(database.db);
const queue = await startJobQueue(config, database.db);
await queue.startWorker({
  db: database.db,
  storage: localDiskStorage(config.storageDir),
  config,
  log: (line) => process.stdout.write(`${line}\n`),
});
process.stdout.write(`[arcbench] worker ${process.pid} handling extraction jobs (queue schema ${config.jobSchema})\n`);
process.send?.({ ready: true });

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  process.stdout.write(`[arcbench] worker ${signal}: finishing the current job and stopping\n`);
  await queue.stop();
  await database.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
