import request from 'supertest';
import { createApp } from '../../server/app';
import type { AppDeps } from '../../server/app-deps';
import { loadConfig, type Config } from '../../server/config';
import { connect } from '../../server/db/client';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer } from '../../server/mail/mailer';
import { startJobQueue, type JobQueue } from '../../server/jobs/queue';
import { createStorage } from '../../server/storage/create-storage';
import { createLogger } from '../../server/http/logger';
import { buildOpenApi } from '../../server/http/openapi';
import type { RouteSpec } from '../../server/http/route-table';
import { s3Run } from './api-s3-run';
import { installContractCheck, type ContractCheck } from './contract';

export interface TestApp {
  app: ReturnType<typeof createApp>;
  deps: AppDeps;
  /** Present when the test asked for the job queue. */
  queue?: JobQueue;
  /** Every API answer of this app checked against its OpenAPI document (tests/support/contract.ts). */
  contract: ContractCheck;
  /** Also fails the test file when an answer broke the documented contract. */
  close: () => Promise<void>;
}

export interface TestAppOptions {
  /**
   * Start the real job queue (pg-boss on the test database): 'worker' also runs
   * the handlers in this process, 'send-only' leaves them to a separate worker.
   * Give the test file its own config.jobSchema so its jobs stay its own.
   */
  jobs?: 'worker' | 'send-only';
  /**
   * In the S3 run, jobs normally go to the run's two `npm run worker` processes;
   * a test that runs workers of its own keeps its config.jobSchema and worker choice.
   */
  ownWorkers?: boolean;
}

/** The real app on the real test database, with the local SMTP fake; one per test file. */
export async function createTestApp(overrides: Partial<Config> = {}, extraDeps: Partial<AppDeps> = {}, options: TestAppOptions = {}): Promise<TestApp> {
  const s3 = s3Run();
  let config = { ...loadConfig(), ...overrides };
  if (s3) {
    // The S3 run (project api-s3): clips in the fake, jobs to the two `npm run worker`
    // processes on the shared queue, and a local storage folder that must stay empty.
    config = { ...loadConfig({ ...process.env, ...s3.storageEnv }), ...overrides };
    config.storageDir = overrides.storageDir ?? s3.newLocalStorageDir('app');
    if (!options.ownWorkers) {
      config = { ...config, jobSchema: s3.jobSchema, inProcessWorker: false };
      if (options.jobs === 'worker') options = { ...options, jobs: 'send-only' };
    }
  }
  const database = connect(config.databaseUrl, 4);
  const smtp = await startFakeSmtp(database.db);
  const mailer = createMailer(smtp.url, config.mailFrom);
  const storage = createStorage(config, s3 ? s3.newLocalStorageDir('scratch') : undefined);
  // Request logs stay out of the test output unless a test brings a logger of its own (tests/api/logs.test.ts).
  const deps: AppDeps = { config, db: database.db, pool: database.pool, mailer, storage, logger: createLogger('silent'), ...extraDeps } as AppDeps;
  let queue: JobQueue | undefined;
  if (options.jobs) {
    queue = await startJobQueue(config, database.db, { supervise: options.jobs === 'worker' });
    deps.jobs = queue.jobs;
    if (options.jobs === 'worker') await queue.startWorker({ db: database.db, storage: deps.storage, config });
  }
  const app = createApp(deps);
  const contract = installContractCheck(app, buildOpenApi(app.locals.routeSpecs as RouteSpec[], 'test') as never);
  return {
    app,
    deps,
    queue,
    contract,
    close: async () => {
      await queue?.stop();
      mailer.close();
      await smtp.close();
      await database.close();
      if (contract.violations.length > 0) {
        throw new Error(`Answers that break the OpenAPI document (server/http/openapi.ts):\n${[...new Set(contract.violations)].join('\n')}`);
      }
    },
  };
}

/** A supertest agent that keeps cookies and sends the CSRF header on every request. */
export function agent(app: TestApp['app']) {
  const a = request.agent(app);
  a.set('X-Arcbench-Request', '1');
  return a;
}

export async function signInAs(app: TestApp['app'], email: string, password: string) {
  const a = agent(app);
  const res = await a.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return a;
}

export function uniqueSuffix(): string {
  return `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 8)}`;
}
