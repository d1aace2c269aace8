// Dependency rules of Riparia's layout (see DEVELOPERS.md, "Boundaries"). `npm run lint` runs them.
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
	forbidden: [
		{
			name: 'no-cycles',
			comment: 'Modules import each other in one direction only; a cycle means a responsibility sits in the wrong place.',
			severity: 'error',
			from: {},
			to: { circular: true }
		},
		{
			name: 'routes-do-not-query',
			comment: 'Routes parse, call one domain function and return: no SQL builder, driver or table definitions.',
			severity: 'error',
			from: { path: '^src/routes/' },
			to: { path: ['^node_modules/(drizzle-orm|mysql2)/', '^src/lib/server/db/', '^src/lib/server/[^/]+/schema\\.ts$'] }
		},
		{
			name: 'pure-code-stays-pure',
			comment: 'src/lib/<domain> is pure, typed logic shared with the browser: it never imports server code.',
			severity: 'error',
			from: { path: '^src/lib/', pathNot: '^src/lib/server/' },
			to: { path: '^src/lib/server/' }
		},
		{
			name: 'own-tables-only',
			comment: "A server domain reads and writes only its own tables; another domain's data comes through that domain's functions.",
			severity: 'error',
			// A schema may reference another domain's table for a foreign key; nothing else may.
			from: { path: '^src/lib/server/([^/]+)/', pathNot: '^src/lib/server/([^/]+/schema|db/schema)\\.ts$' },
			to: { path: '^src/lib/server/([^/]+)/schema\\.ts$', pathNot: '^src/lib/server/($1|db)/' }
		},
		{
			name: 'schema-index-for-the-pool-only',
			comment: 'The schema index exists for the Drizzle instance; code imports the schema of its own domain.',
			severity: 'error',
			from: { path: '^src/', pathNot: '^src/lib/server/db/index\\.ts$' },
			to: { path: '^src/lib/server/db/schema\\.ts$' }
		},
		{
			name: 'shared-services-know-no-feature',
			comment: 'Media, mail, audit, jobs and markdown serve every feature and depend on none (features register with them).',
			severity: 'error',
			from: { path: '^src/lib/server/(media|mail|audit|markdown|http)(/|\\.ts$)', pathNot: '^src/lib/server/[^/]+/schema\\.ts$' },
			to: { path: '^src/lib/server/(journals|swaps|contests|care|club|species)/' }
		},
		{
			name: 'server-modules-do-not-import-components',
			comment: 'Types shared between a component and the server live in $lib/<domain>, not in a .svelte file.',
			severity: 'error',
			from: { path: '(\\.server\\.ts|^src/lib/server/.*\\.ts)$' },
			to: { path: '\\.svelte$' }
		},
		{
			name: 'components-do-not-import-server-code',
			severity: 'error',
			from: { path: '\\.svelte$' },
			to: { path: '^src/lib/server/' }
		}
	],
	options: {
		doNotFollow: { path: 'node_modules' },
		exclude: { path: '^(node_modules|build|\\.svelte-kit|\\.data)/' },
		tsPreCompilationDeps: true,
		tsConfig: { fileName: 'tsconfig.json' },
		// `$lib` (see the file for why tsconfig.json alone does not resolve it).
		webpackConfig: { fileName: '.dependency-cruiser.aliases.cjs' },
		enhancedResolveOptions: {
			exportsFields: ['exports'],
			conditionNames: ['import', 'require', 'node', 'default', 'types', 'svelte'],
			extensions: ['.ts', '.js', '.svelte', '.d.ts'],
			mainFields: ['module', 'main', 'types', 'svelte']
		},
		reporterOptions: { text: { highlightFocused: true } }
	}
};
