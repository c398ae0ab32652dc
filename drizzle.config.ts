import { defineConfig } from 'drizzle-kit'

// Migrations are generated here and applied by the server at start-up
// (server/utils/database.ts). Never point drizzle-kit at a running app's data directory.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/database/schema/index.ts',
  out: './server/database/migrations',
  casing: 'snake_case',
})
