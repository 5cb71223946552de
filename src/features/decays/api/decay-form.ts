import type { DecayReadOptionsInput } from '@shared/schemas/decays';

/** The multipart body of the decay routes: the file, the response file if any, the choices as JSON. */
export function decayForm(input: { file: File; response: File | null; options: DecayReadOptionsInput }) {
  const form = new FormData();
  form.append('file', input.file);
  if (input.response) form.append('response', input.response);
  form.append('options', JSON.stringify(input.options));
  return form;
}
export type DecayFormInput = Parameters<typeof decayForm>[0];
