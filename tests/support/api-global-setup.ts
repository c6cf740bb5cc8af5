// API tests need the real PostgreSQL that scripts/test.mjs starts (migrated and seeded).
export default function setup() {
  if (!process.env.DATABASE_URL) {
    throw new Error('DATABASE_URL is not set: run the API tests through `npm test`, which starts a throwaway PostgreSQL.');
  }
}
