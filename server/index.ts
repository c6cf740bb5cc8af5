// The Arcbench server: migrates, starts the mail fake when no SMTP_URL is set,
// and serves the API and the built client on one port.
import { loadConfig } from './config';
import { connect } from './db/client';
import { applyMigrations, ensureDatabase } from './db/migrate';
import { createApp } from './app';
import { createMailer } from './mail/mailer';
import { startFakeSmtp } from './mail/fake-smtp';
import { startBackground, type Background } from './background';
import { createStorage, describeStorage } from './storage/create-storage';
import { prepareScratch } from './storage/scratch';
import { sweepAbandoned } from './storage/sweep-abandoned';
import { primeFfmpegProbe } from './health/system-status';

const config = loadConfig();
await ensureDatabase(config.databaseUrl);
const database = connect(config.databaseUrl);
await applyMigrations(database.db);

// What a killed predecessor left behind: half-received uploads, frames never moved into the store.
const swept = await sweepAbandoned({ storageDir: config.storageDir, db: database.db, staleSeconds: config.jobStaleSeconds });
if (swept.partialUploads.length + swept.extractionFolders.length > 0) {
  process.stdout.write(`[arcbench] Removed ${swept.partialUploads.length} unfinished upload(s) and ${swept.extractionFolders.length} abandoned frame folder(s) left by a stopped server\n`);
}
void primeFfmpegProbe();

const fakeSmtp = config.smtpUrl ? null : await startFakeSmtp(database.db);
const mailer = createMailer(config.smtpUrl ?? fakeSmtp!.url, config.mailFrom);
// On an object store the in-process worker needs scratch space of its own; local disk uses <STORAGE_DIR>/tmp.
const scratch = config.storage.kind === 's3' ? await prepareScratch(config.scratchDir) : null;
const deps = { config, db: database.db, pool: database.pool, mailer, storage: createStorage(config, scratch?.dir) };
process.stdout.write(`[arcbench] Clip storage: ${describeStorage(config)}\n`);
const background: Background = await startBackground(deps);
const app = createApp({ ...deps, ...background.deps });

const server = app.listen(config.port, config.host, () => {
  process.stdout.write(`[arcbench] API and app listening on ${config.publicUrl}\n`);
  if (fakeSmtp) process.stdout.write(`[arcbench] No SMTP_URL set: mail goes to the local outbox (${fakeSmtp.url})\n`);
  process.send?.({ ready: true, url: config.publicUrl });
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  process.stdout.write(`[arcbench] ${signal}: stopping server\n`);
  server.close();
  server.closeAllConnections();
  await background.stop().catch(() => {});
  mailer.close();
  await fakeSmtp?.close();
  await scratch?.cleanup().catch(() => {});
  await database.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
