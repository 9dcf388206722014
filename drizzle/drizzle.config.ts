import { defineConfig } from 'drizzle-kit';

// Generate migrations with `npm run db:generate`; never `push` to a shared database.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/src/db/schema/index.ts',
  out: './drizzle/migrations',
  casing: 'snake_case',
});
