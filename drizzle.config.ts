import { defineConfig } from 'drizzle-kit';

// Migrations are generated from server/db/schema.ts (`npm run db:generate`) and committed; never edit them by hand.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema.ts',
  out: './drizzle',
});
