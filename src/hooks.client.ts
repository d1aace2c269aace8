import { z } from 'zod';

// zod compiles object parsers with `new Function` when it may; under our CSP (no 'unsafe-eval')
// even its probe for that is reported as a violation. Parse without it in the browser.
z.config({ jitless: true });
