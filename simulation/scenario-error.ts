/**
 * The engine's refusal of its input: a scenario (or forecast option) that cannot be forecast,
 * with one message per field. The API answers it as a 400 `validation` error with the same
 * `fields` map (shared/api-error.ts).
 */

interface Issue {
  path: PropertyKey[];
  message: string;
  code?: string;
  errors?: readonly (readonly Issue[])[];
}

/**
 * A union's issues as the one option that matched the input's type would give them (a single
 * fish group where a list is also accepted), so the message names the field inside; otherwise
 * the union's own issue.
 */
function unionIssues(issue: Issue): readonly Issue[] {
  if (issue.code !== 'invalid_union' || !issue.errors) return [issue];
  const typeMismatch = (list: readonly Issue[]) => list.length === 1 && list[0]!.code === 'invalid_type' && list[0]!.path.length === 0;
  const fitting = issue.errors.filter((list) => list.length > 0 && !typeMismatch(list));
  if (fitting.length !== 1) return [issue];
  return fitting[0]!.flatMap((inner) => unionIssues({ ...inner, path: [...issue.path, ...inner.path] }));
}

/** Turns zod issues into a `fields` map: dot-joined path (`_` for the root) → first message. */
export function fieldErrors(issues: readonly Issue[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues.flatMap(unionIssues)) {
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
