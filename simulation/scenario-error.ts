/**
 * The engine's refusal of its input: a scenario (or forecast option) that cannot be forecast,
 * with one message per field. The API answers it as a 400 `validation` error with the same
 * `fields` map (shared/api-error.ts).
 */

/** Turns zod issues into a `fields` map: dot-joined path (`_` for the root) → first message. */
export function fieldErrors(issues: readonly { path: PropertyKey[]; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.') || '_';
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}

/** A scenario that cannot be forecast; `fields` maps a dot-joined path to a message. */
export class ScenarioError extends Error {
  readonly fields: Record<string, string>;
  constructor(fields: Record<string, string>) {
    const first = Object.entries(fields)[0];
    super(first ? `Invalid scenario: ${first[0]}: ${first[1]}` : 'Invalid scenario');
    this.name = 'ScenarioError';
    this.fields = fields;
  }
}
