import type { UseFormReturn } from 'react-hook-form';
import { createStudySchema, type CreateStudyBody, type StudyFormOptions } from '@shared/schemas/studies';
import { ApiError } from '@/lib/api-client';
import { describeError } from '@/lib/form-errors';
import { CUSTOM, fieldOfPath, NEW, toBody, type StudyFormValues } from './study-form-values';

/* The choices and the submit handler both study forms use (their shared fields: study-form-parts.tsx). */

/** The lab's compounds for one role: those listed for it first, then the others, then "a new compound". */
export function compoundChoices(compounds: StudyFormOptions['compounds'], role: 'photocatalyst' | 'quencher') {
  const fits = (c: StudyFormOptions['compounds'][number]) => c.roleHint === role || c.roleHint === 'both';
  return [
    { value: '', label: '— pick —' },
    ...compounds.filter(fits).map((c) => ({ value: c.id, label: c.name })),
    ...compounds.filter((c) => !fits(c)).map((c) => ({ value: c.id, label: `${c.name} (listed as ${c.roleHint})` })),
    { value: NEW, label: '+ a new compound…' },
  ];
}

export function solventChoices(options: StudyFormOptions | undefined) {
  return [
    ...(options?.solvents ?? []).map((s) => ({ value: s.id, label: s.name })),
    { value: CUSTOM, label: 'another solvent…' },
  ];
}

/**
 * The submit handler of a study form: the body checked against the same schema as the server,
 * then sent; each problem (from the check or from the server's 400) placed beside its field, the
 * rest above the button.
 */
export function studySubmit(
  form: Pick<UseFormReturn<StudyFormValues>, 'handleSubmit' | 'setError'>,
  options: StudyFormOptions | undefined,
  send: (body: CreateStudyBody, values: StudyFormValues) => Promise<unknown>,
) {
  const place = (issues: Array<{ path: string; message: string }>) => {
    let placed = false;
    for (const issue of issues) {
      const field = fieldOfPath[issue.path.replace(/^body\./, '')];
      if (field) {
        form.setError(field, { message: issue.message });
        placed = true;
      }
    }
    if (!placed)
      form.setError('root.server', { message: issues.map((issue) => `${issue.path}: ${issue.message}`).join('; ') });
  };
  return form.handleSubmit(async (values) => {
    const body = toBody(values, options);
    const checked = createStudySchema.safeParse(body);
    if (!checked.success)
      return place(checked.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message })));
    try {
      await send(body, values);
    } catch (error) {
      if (error instanceof ApiError && error.details.length) place(error.details);
      else form.setError('root.server', { message: describeError(error) });
    }
  });
}
