import { InitialSchema1796162158000 } from './1796162158000-initial-schema.js';

/** In order. Listed as classes (not globs) so tsx, compiled JS and vitest agree. */
export const migrations = [InitialSchema1796162158000];
