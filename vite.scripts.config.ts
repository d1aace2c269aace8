// Builds the database scripts (migrations, the seed, backup and restore) into build/scripts/*.js, so a production
// install runs them with plain Node after `npm prune --omit=dev` (no tsx). Run by `npm run build`
// after the app's own build, which empties build/ first. Like adapter-node's build, packages in
// `dependencies` stay imports from node_modules and everything else is bundled.
import { cpSync, readFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { defineConfig } from 'vite';

const runtime = Object.keys((JSON.parse(readFileSync('package.json', 'utf8')) as { dependencies: Record<string, string> }).dependencies);
const external = (id: string) => id.startsWith('node:') || builtinModules.includes(id) || runtime.some((name) => id === name || id.startsWith(`${name}/`));

export default defineConfig({
	publicDir: false,
	ssr: { noExternal: true },
	build: {
		ssr: true,
		target: 'node20',
		outDir: 'build/scripts',
		emptyOutDir: true,
		minify: false,
		sourcemap: true,
		rolldownOptions: {
			input: { migrate: 'scripts/migrate.ts', seed: 'scripts/seed.ts', backup: 'scripts/backup.ts', restore: 'scripts/restore.ts' },
			external,
			output: { format: 'es', entryFileNames: '[name].js', chunkFileNames: 'chunks/[name]-[hash].js' }
		}
	},
	plugins: [
		{
			name: 'riparia-copy-migrations',
			// The migrations this build expects travel with it (build/drizzle), like /readyz's copy of the journal.
			writeBundle: () => cpSync('drizzle', 'build/drizzle', { recursive: true })
		}
	]
});
