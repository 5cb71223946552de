import { useState } from 'react';
import type { DecayModel, DecayTimeUnit } from '@shared/schemas/decays';
import { DEFAULT_DECAY_MODEL } from './decay-file-choices';

/** What a decay reading sends: the decay file, the response file if any, and the read options. */
export interface DecayRead {
  file: File;
  response: File | null;
  options: { model: DecayModel; timeUnit: DecayTimeUnit | null; show: number };
}

/** A change to read with at once (a file just chosen, a decay to show); the rest as chosen before. */
interface DecayReadChange {
  file?: File;
  response?: File | null;
  show?: number;
}

/**
 * The choices of a decay reading: the files, the model and the time unit. `look` is called with
 * what to read each time a file is chosen, a decay is shown or "Fit again" is pressed.
 */
export function useDecayReadChoices(look: (read: DecayRead) => void) {
  const [file, setFile] = useState<File | null>(null);
  const [response, setResponse] = useState<File | null>(null);
  const [model, setModel] = useState<DecayModel>(DEFAULT_DECAY_MODEL);
  const [timeUnit, setTimeUnit] = useState<DecayTimeUnit | null>(null);
  /** The reading as chosen, with the change applied; null before a decay file is chosen. */
  const readOf = (next: DecayReadChange = {}): DecayRead | null => {
    const chosen = next.file ?? file;
    if (!chosen) return null;
    const sent = next.response !== undefined ? next.response : response;
    return { file: chosen, response: sent, options: { model, timeUnit, show: next.show ?? 0 } };
  };
  const lookAt = (next: DecayReadChange = {}) => {
    const read = readOf(next);
    if (read) look(read);
  };
  return { file, response, model, timeUnit, setFile, setResponse, setModel, setTimeUnit, readOf, lookAt };
}

export type DecayReadChoices = ReturnType<typeof useDecayReadChoices>;
