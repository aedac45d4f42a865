import { z } from 'zod';

/** The one error body every `/api` route answers with (4xx and 5xx alike). */
export const apiErrorSchema = z.object({
  error: z.object({
    /** Stable machine id, e.g. `validation`, `unauthorized`, `not_found`. */
    code: z.string(),
    /** A sentence a person can read. */
    message: z.string(),
    /** For `validation`: field path (dot-joined, e.g. `zones.0.area`) → message. */
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

/**
 * Unsafe requests (POST/PUT/PATCH/DELETE) to `/api` must carry this header with this value.
 * A cross-site form or a "simple" fetch cannot set a custom header, so its presence proves the
 * request came from our own script (OWASP CSRF cheat sheet, "custom request headers").
 */
export const CSRF_HEADER = 'x-shoalshift-csrf';
export const CSRF_HEADER_VALUE = '1';

/** Turns zod issues into the `fields` map of an ApiError (the engine's own rule, simulation/scenario-error.ts). */
export { fieldErrors } from '../simulation/scenario-error';
