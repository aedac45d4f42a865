import { z } from 'zod';

// zod decides per schema, when the schema is built, whether to compile a fast parser with
// `new Function`; under our Content Security Policy (no 'unsafe-eval') that probe is reported
// as a violation. This module runs before any schema module (see index.ts).
z.config({ jitless: true });
