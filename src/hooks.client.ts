// zod compiles object parsers with `new Function` when it may; under our CSP (no 'unsafe-eval')
// even its probe for that, made when a schema is built, is reported as a violation. So zod must
// run jitless in the browser. Its settings live on globalThis (`__zod_globalConfig`, created by its
// core module only when missing, and what `z.config()` writes to): seeding them here, before any
// page module loads, does what `z.config({ jitless: true })` does without importing zod, which kept
// about 4 kB of zod in every page's script, pages that never build a schema included. If a zod
// upgrade stopped reading this, the CSP check over every page (tests/e2e/console.spec.ts) fails.
const zodSettings = ((globalThis as { __zod_globalConfig?: Record<string, unknown> }).__zod_globalConfig ??= {});
zodSettings.jitless = true;
