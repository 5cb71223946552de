import { useEffect } from 'react';
import { useParams } from 'react-router-dom';
import type { LabMembership } from '@shared/schemas/auth';

const storageKey = 'halflight.current-lab';

function readRememberedLab(): string | null {
  try {
    return window.localStorage.getItem(storageKey);
  } catch {
    return null; // Storage can be switched off; the first lab is then the default.
  }
}

/** Keeps the lab a person last worked in, so the next visit opens there. */
export function rememberLab(labId: string): void {
  try {
    window.localStorage.setItem(storageKey, labId);
  } catch {
    // Nothing to do: without storage the choice lasts only as long as the address.
  }
}

/** The lab in the address, else the remembered one, else the first; null for a person with no labs. */
export function pickCurrentLab(labs: LabMembership[], labIdInAddress?: string): LabMembership | null {
  const remembered = readRememberedLab();
  return (
    labs.find((lab) => lab.labId === labIdInAddress) ?? labs.find((lab) => lab.labId === remembered) ?? labs[0] ?? null
  );
}

/** The lab the screens are about right now; opening a lab's address makes it the remembered one. */
export function useCurrentLab(labs: LabMembership[]): LabMembership | null {
  const { labId } = useParams();
  const current = pickCurrentLab(labs, labId);
  const currentId = current?.labId;
  useEffect(() => {
    if (currentId && currentId === labId) rememberLab(currentId);
  }, [currentId, labId]);
  return current;
}
