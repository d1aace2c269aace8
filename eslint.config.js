import js from '@eslint/js';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import ts from 'typescript-eslint';
import svelteConfig from './svelte.config.js';

export default ts.config(
	{ ignores: ['build/', '.svelte-kit/', '.data/', 'node_modules/', 'drizzle/meta/', 'bench/results/'] },
	js.configs.recommended,
	...ts.configs.recommended,
	...svelte.configs.recommended,
	{
		languageOptions: {
			globals: { ...globals.browser, ...globals.node },
			// Type-aware: the promise rules below need the types.
			parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname, extraFileExtensions: ['.svelte'] }
		},
		rules: {
			// TypeScript checks undefined names itself (svelte-check), with better knowledge of globals.
			'no-undef': 'off',
			// Riparia is served at the site root (no kit.paths.base), so plain hrefs are correct.
			'svelte/no-navigation-without-resolve': 'off',
			'@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
			// A promise nobody awaits loses its errors and its ordering; mark deliberate ones with `void`.
			'@typescript-eslint/no-floating-promises': 'error',
			'@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }]
		}
	},
	{
		files: ['**/*.svelte', '**/*.svelte.ts'],
		languageOptions: { parserOptions: { projectService: true, extraFileExtensions: ['.svelte'], parser: ts.parser, svelteConfig } }
	},
	{
		// Plain JavaScript config files are not part of the TypeScript project.
		files: ['**/*.js', '**/*.cjs', '**/*.mjs'],
		...ts.configs.disableTypeChecked
	}
);
