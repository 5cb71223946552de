/**
 * A warning (or refusal) the engine attaches to a result, whatever the method: a stable code and
 * the plain words that go with it. Each method keeps its own codes (QualityFlagCode, DecayFlagCode).
 */
export interface EngineFlag<Code extends string> {
  code: Code;
  /** 'error' when the result cannot be used as it stands, else 'warning' */
  severity: 'warning' | 'error';
  title: string;
  /** what the flag means, in plain words */
  explanation: string;
  /** what to look at before trusting the number */
  whatToCheck: string[];
  /** the next step, in one sentence */
  whatToDo: string;
  /** the numbers that raised the flag, e.g. "kq 2.4e10 vs limit 1.9e10 M^-1 s^-1" */
  detail?: string;
}

/** The standard words of one flag code. */
export type FlagText = Pick<EngineFlag<string>, 'title' | 'explanation' | 'whatToCheck' | 'whatToDo'>;

/**
 * A flag built from a method's table of standard words; the check-list is copied, so a caller that
 * changes one flag's list leaves the table alone.
 *
 * @example engineFlag({ A: { title: 't', explanation: 'e', whatToCheck: [], whatToDo: 'd' } }, 'A').severity // 'warning'
 */
export function engineFlag<Code extends string>(
  texts: Record<Code, FlagText>,
  code: Code,
  detail?: string,
  severity: 'warning' | 'error' = 'warning',
): EngineFlag<Code> {
  const text = texts[code];
  return { code, severity, ...text, whatToCheck: [...text.whatToCheck], ...(detail === undefined ? {} : { detail }) };
}
