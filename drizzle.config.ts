import { defineConfig } from 'drizzle-kit';

// `drizzle-kit generate` only diffs the schema files against drizzle/meta; it needs no database.
// Migrations are applied by scripts/lib/migrate.ts with a single connection.
export default defineConfig({
	dialect: 'mysql',
	schema: './src/lib/server/db/schema.ts',
	out: './drizzle',
	casing: 'snake_case'
});
