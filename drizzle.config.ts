import { defineConfig } from 'drizzle-kit';

// Migrations are generated (`npm run db:generate`), committed, and applied by
// migrate() at start. Never `drizzle-kit push`.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/*.ts',
  out: './drizzle',
  casing: 'snake_case',
});
