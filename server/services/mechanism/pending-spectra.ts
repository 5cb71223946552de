import type { AbsorptionAnalysisAnswer, AbsorptionSettings } from '@shared/schemas/absorption-titrations';
import type { SpectrumMatrixAnalysisAnswer } from '@shared/schemas/spectrum-matrices';

/**
 * A change to a study's spectra not yet written: a matrix or titration analysed again (its new
 * analysis) or discarded (null). mechanismEvidence reads the study as if it were written, so the
 * verdict after the change goes into the same audit entry as the verdict before it.
 */
export interface PendingSpectra {
  spectrumMatrix?: { id: string; analysis: SpectrumMatrixAnalysisAnswer | null };
  absorptionTitration?: {
    id: string;
    change: { analysis: AbsorptionAnalysisAnswer; settings: AbsorptionSettings } | null;
  };
}
