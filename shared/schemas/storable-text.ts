import { z } from 'zod';

// NUL, or half of a UTF-16 surrogate pair without the other half. PostgreSQL refuses both in
// text and JSONB ("invalid byte sequence for encoding UTF8: 0x00", "unsupported Unicode escape
// sequence"; a lone surrogate cannot be encoded as UTF-8 at all), so they never reach it.
// eslint-disable-next-line no-control-regex -- finding NUL is what this pattern is for
const unstorable = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const storableTextMessage = 'must not contain NUL characters or unpaired surrogates (broken Unicode)';

/** True when PostgreSQL can store the text as it is. */
export const isStorableText = (text: string): boolean => !unstorable.test(text);

interface Visit {
  value: unknown;
  key: string | number | null;
  parent: Visit | null;
}

function pathOf(visit: Visit, last?: string): Array<string | number> {
  const path: Array<string | number> = last === undefined ? [] : [last];
  for (let at: Visit | null = visit; at && at.key !== null; at = at.parent) path.push(at.key);
  return path.reverse();
}

// Enough to name what is wrong; a body made of thousands of bad strings need not list them all.
const mostReported = 20;

/**
 * Paths of the strings (object keys too) that hold unstorable text (at most 20). Iterative,
 * and each visit keeps only a link to its parent, so the cost grows with the size of the value
 * (no deep recursion, no path copied per level) however deeply it is nested.
 */
function unstorableStrings(value: unknown): Array<Array<string | number>> {
  const found: Array<Array<string | number>> = [];
  const pending: Visit[] = [{ value, key: null, parent: null }];
  while (pending.length && found.length < mostReported) {
    const visit = pending.pop()!;
    if (typeof visit.value === 'string') {
      if (!isStorableText(visit.value)) found.push(pathOf(visit));
    } else if (Array.isArray(visit.value)) {
      for (let index = visit.value.length - 1; index >= 0; index--) {
        pending.push({ value: visit.value[index], key: index, parent: visit });
      }
    } else if (visit.value !== null && typeof visit.value === 'object') {
      const entries = Object.entries(visit.value);
      for (const [key] of entries) if (!isStorableText(key)) found.push(pathOf(visit, key));
      for (let index = entries.length - 1; index >= 0; index--) {
        pending.push({ value: entries[index]![1], key: entries[index]![0], parent: visit });
      }
    }
  }
  return found;
}

/**
 * The one refinement for text fields: any part of a request (body, query, path) in which a
 * string anywhere holds NUL or an unpaired surrogate fails with an issue naming that field. The
 * route layer applies it to every part of every route before the route's own schema, so no
 * schema or route has to remember it.
 */
export const storableInput = z.unknown().superRefine((value, context) => {
  for (const path of unstorableStrings(value)) {
    context.addIssue({ code: 'custom', path, message: storableTextMessage });
  }
});
