/**
 * Every way the engine can refuse an input. Callers (server routes, client forms)
 * switch on `code`; the message is for people.
 */
export type EngineErrorCode =
  | 'INVALID_ARGUMENT'
  | 'LENGTH_MISMATCH'
  | 'NON_FINITE_VALUE'
  | 'NEGATIVE_VALUE'
  | 'NON_POSITIVE_VALUE'
  | 'TOO_FEW_CONCENTRATIONS'
  | 'TOO_FEW_POINTS'
  | 'MISSING_I0'
  | 'MISSING_TAU0'
  | 'DEGENERATE_DATA'
  | 'NOT_DETERMINED'
  | 'MODEL_NOT_APPLICABLE'
  | 'FIT_DID_NOT_CONVERGE'
  | 'WAVELENGTH_OUT_OF_RANGE'
  | 'UNKNOWN_REFERENCE_ELECTRODE'
  | 'REFERENCE_NOT_AVAILABLE_FOR_SOLVENT'
  | 'UNKNOWN_SOLVENT'
  | 'MISSING_SOLVENT_DATA'
  | 'MISSING_POTENTIAL'
  | 'TARGET_UNREACHABLE';

/**
 * The one error class of the engine. The message always reads
 * "<field>: <problem>. <what to do>" (the last part only when there is advice),
 * so it can be shown beside a form field as it is.
 *
 * @example
 * new EngineError('MISSING_I0', 'intensities', 'no point at zero quencher concentration', 'Add a blank or give I0')
 * // message: "intensities: no point at zero quencher concentration. Add a blank or give I0."
 */
export class EngineError extends Error {
  override readonly name = 'EngineError';
  readonly code: EngineErrorCode;
  readonly field: string;

  constructor(code: EngineErrorCode, field: string, problem: string, advice?: string) {
    super(`${field}: ${problem}.${advice ? ` ${advice}.` : ''}`);
    this.code = code;
    this.field = field;
  }
}
