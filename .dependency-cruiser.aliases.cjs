// SvelteKit's `$lib` alias for dependency-cruiser. It is declared in .svelte-kit/tsconfig.json
// with paths relative to that folder, which the tsconfig-paths resolver dependency-cruiser uses
// reads as relative to the project: every `$lib/...` import went unresolved, and the rules for
// routes and components checked nothing. Read through the `webpackConfig` option.
module.exports = { resolve: { alias: { $lib: `${__dirname}/src/lib` } } };
