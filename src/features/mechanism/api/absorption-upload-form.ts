/** What the absorption panel sends, as typed (the server checks each field; empty means its default). */
export interface AbsorptionInput {
  file: File;
  quencher: File | null;
  /** nm; 0 for one band per wavelength */
  bandWidth: string;
  /** cm */
  pathLength: string;
  /** mol/L, already converted from the µM the form shows; empty when not given */
  emitterConcentration: string;
}

/** The multipart body of a preview or a keep: "file", optional "quencher", and the three options. */
export function absorptionForm(input: AbsorptionInput): FormData {
  const form = new FormData();
  form.append('file', input.file);
  if (input.quencher) form.append('quencher', input.quencher);
  form.append('bandWidth', input.bandWidth);
  form.append('pathLength', input.pathLength);
  form.append('emitterConcentration', input.emitterConcentration);
  return form;
}
