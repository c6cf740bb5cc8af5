// `npm run admin:create`: the first admin of a real installation (production
// mode seeds no demo team). Creates a user and a team with that user as admin.
//
//   npm run admin:create                                   # asks for everything
//   npm run admin:create -- --email a@b.example --name "Ada Byrne" --team "Test Range" [--site "North field"]
//
// The password is asked for (not echoed) when stdin is a terminal; otherwise it
// is read from the first line of stdin (`--password-stdin`, for scripts) or from
// ARCBENCH_ADMIN_PASSWORD. It is never taken as a flag, which would leave it in
// the shell history and the process list.
import { createInterface } from 'node:readline';
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { DisplayName, Email, NewPassword } from '../../shared/schemas/common';
import { hashPassword } from '../auth/passwords';
import { loadConfig } from '../config';
import { connect } from '../db/client';
import { applyMigrations, ensureDatabase } from '../db/migrate';
import { users } from '../db/schema/users';
import { createTeam } from '../teams/create-team';

const TeamName = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');

function flags(argv: string[]): Record<string, string | true> {
  const out: Record<string, string | true> = {};
  for (let i = 0; i < argv.length; i++) {
    const m = /^--([a-z-]+)(?:=(.*))?$/.exec(argv[i]);
    if (!m) throw new Error(`Unexpected argument ${argv[i]} (flags: --email --name --team --site --password-stdin)`);
    if (m[2] !== undefined) out[m[1]] = m[2];
    else if (argv[i + 1] !== undefined && !argv[i + 1].startsWith('--')) out[m[1]] = argv[++i];
    else out[m[1]] = true;
  }
  return out;
}

/** One line from a terminal; `hidden` stops the typed characters from being echoed. */
function ask(question: string, hidden = false): Promise<string> {
  const rl = createInterface({ input: process.stdin, output: process.stdout, terminal: true });
  if (hidden) {
    const out = rl as unknown as { _writeToOutput: (s: string) => void; output: NodeJS.WriteStream };
    out._writeToOutput = (s: string) => {
      if (s.includes(question)) out.output.write(s);
    };
  }
  return new Promise((resolve) =>
    rl.question(question, (answer) => {
      rl.close();
      if (hidden) process.stdout.write('\n');
      resolve(answer);
    }),
  );
}

async function firstStdinLine(): Promise<string> {
  const rl = createInterface({ input: process.stdin });
  for await (const line of rl) {
    rl.close();
    return line;
  }
  return '';
}

function check<T>(schema: z.ZodType<T>, value: unknown, what: string): T {
  const r = schema.safeParse(value);
  if (!r.success) throw new Error(`${what} ${r.error.issues[0]?.message ?? 'is not valid'}.`);
  return r.data;
}

async function main() {
  const f = flags(process.argv.slice(2));
  const tty = process.stdin.isTTY === true;
  const value = async (key: string, question: string) => {
    if (typeof f[key] === 'string') return f[key] as string;
    if (!tty) throw new Error(`--${key} is required when not run in a terminal.`);
    return ask(question);
  };
  const email = check(Email, await value('email', 'E-mail of the first admin: '), 'The e-mail');
  const name = check(DisplayName, await value('name', 'Their name: '), 'The name');
  const team = check(TeamName, await value('team', 'Name of their team: '), 'The team name');
  const site = typeof f.site === 'string' ? f.site.trim() || null : null;
  let password: string;
  if (f['password-stdin'] === true || (!tty && !process.env.ARCBENCH_ADMIN_PASSWORD)) password = await firstStdinLine();
  else if (process.env.ARCBENCH_ADMIN_PASSWORD) password = process.env.ARCBENCH_ADMIN_PASSWORD;
  else {
    password = await ask('Password (at least 10 characters): ', true);
    if ((await ask('The same password again: ', true)) !== password) throw new Error('The two passwords differ; nothing was created.');
  }
  password = check(NewPassword, password, 'The password');

  const config = loadConfig();
  await ensureDatabase(config.databaseUrl);
  const database = connect(config.databaseUrl, 2);
  try {
    await applyMigrations(database.db);
    const [existing] = await database.db.select({ id: users.id }).from(users).where(eq(users.email, email));
    if (existing) throw new Error(`A user with the e-mail ${email} exists already; nothing was created. Sign in as them, or invite the new admin from the team page.`);
    const [user] = await database.db
      .insert(users)
      .values({ email, displayName: name, passwordHash: await hashPassword(password) })
      .returning({ id: users.id });
    const created = await createTeam(database.db, user.id, { name: team, siteName: site });
    process.stdout.write(`[arcbench] Created ${email} as admin of the team "${created?.name ?? team}". Sign in at ${config.publicUrl}.\n`);
  } finally {
    await database.close();
  }
}

main().catch((err) => {
  process.stderr.write(`[arcbench] admin:create: ${(err as Error).message}\n`);
  process.exitCode = 1;
});
