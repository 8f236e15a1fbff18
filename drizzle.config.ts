import { defineConfig } from 'drizzle-kit';

// Migrations are generated from the schema into drizzle/ and applied by packages/db's migrator.
// Never `drizzle-kit push`: it has dropped row-level-security policies.
export default defineConfig({
  dialect: 'postgresql',
  schema: './packages/db/src/schema/index.ts',
  out: './drizzle',
  strict: true,
});
