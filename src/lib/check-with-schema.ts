import type { z } from 'zod';

export type CheckResult<T> = { ok: true; data: T } | { ok: false; errors: Record<string, string> };

/**
 * Checks a form's values with a shared zod schema that is fetched on first use, for the few
 * screens that must draw before the schema library arrives (the sign-in screen's first load stays
 * small). The messages are the schema's, keyed by the first segment of each issue's path.
 */
export async function checkWithSchema<S extends z.ZodType>(
  loadSchema: () => Promise<S>,
  values: unknown,
): Promise<CheckResult<z.output<S>>> {
  const schema = await loadSchema();
  const result = schema.safeParse(values);
  if (result.success) return { ok: true, data: result.data };
  const errors: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const field = String(issue.path[0] ?? 'form');
    errors[field] ??= issue.message;
  }
  return { ok: false, errors };
}
