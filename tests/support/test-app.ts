import request from 'supertest';
import { createApp } from '../../server/app';
import type { AppDeps } from '../../server/app-deps';
import { loadConfig, type Config } from '../../server/config';
import { connect } from '../../server/db/client';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer } from '../../server/mail/mailer';

export interface TestApp {
  app: ReturnType<typeof createApp>;
  deps: AppDeps;
  close: () => Promise<void>;
}

/** The real app on the real test database, with the local SMTP fake; one per test file. */
export async function createTestApp(overrides: Partial<Config> = {}, extraDeps: Partial<AppDeps> = {}): Promise<TestApp> {
  const config = { ...loadConfig(), ...overrides };
  const database = connect(config.databaseUrl, 4);
  const smtp = await startFakeSmtp(database.db);
  const mailer = createMailer(smtp.url, config.mailFrom);
  const deps: AppDeps = { config, db: database.db, pool: database.pool, mailer, ...extraDeps } as AppDeps;
  const app = createApp(deps);
  return {
    app,
    deps,
    close: async () => {
      mailer.close();
      await smtp.close();
      await database.close();
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
