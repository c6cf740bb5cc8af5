// `npm run worker`: the job worker as its own process, beside (or instead of)
// the server's in-process worker, on this machine or another. It needs only
// the database (DATABASE_URL) and the storage settings (STORAGE_URL and the
// S3_* / AWS_* variables, or STORAGE_DIR on a shared disk). Its scratch space
// is its own folder, swept at start and removed on exit. On SIGTERM it stops
// taking jobs, lets running ones finish for WORKER_STOP_GRACE_SECONDS, and
// hands the rest back to the queue, where another worker picks them up.
import { loadConfig } from './config';
import { connect } from './db/client';
import { applyMigrations, ensureDatabase } from './db/migrate';
import { loadOpenCv } from './vision/opencv';
import { startJobQueue } from './jobs/queue';
import { createStorage, describeStorage } from './storage/create-storage';
import { prepareScratch } from './storage/scratch';

const config = loadConfig();
await ensureDatabase(config.databaseUrl);
const database = connect(config.databaseUrl, 4 + config.workerConcurrency);
await applyMigrations(database.db);
const scratch = await prepareScratch(config.scratchDir);
const storage = createStorage(config, scratch.dir);
const queue = await startJobQueue(config, database.db);
// Signals are handled before anything slow (OpenCV's start-up blocks for seconds), so a SIGTERM is never missed.
let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  process.stdout.write(`[arcbench] worker ${process.pid} ${signal}: finishing running jobs (up to ${config.workerStopGraceSeconds} s), then handing the rest back\n`);
  await queue.stop(config.workerStopGraceSeconds * 1000);
  await scratch.cleanup().catch(() => {});
  await database.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
await queue.startWorker({
  db: database.db,
  storage,
  config,
  scratchDir: scratch.dir,
  log: (line) => process.stdout.write(`${line}\n`),
});
process.stdout.write(
  `[arcbench] worker ${process.pid}: ${config.workerConcurrency} job(s) at a time, queue schema ${config.jobSchema}, storage ${describeStorage(config)}, scratch ${scratch.dir}\n`,
);
// Auto-mark jobs need OpenCV: load it once per worker now, not on the first job (it takes a few seconds).
void loadOpenCv().catch((err: Error) => process.stdout.write(`[arcbench] OpenCV did not load (auto-marking will fail): ${err.message}\n`));
process.send?.({ ready: true, scratchDir: scratch.dir });
