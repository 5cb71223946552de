import { createContext, useContext } from 'react';
import type { LabMembership } from '@shared/schemas/auth';

export const LabContext = createContext<LabMembership | null>(null);

/**
 * The signed-in person's membership in the lab of the address (name, role, demo or not), looked up
 * once by `LabLayout` for every screen under `labs/:labId`. Screens outside that layout have no lab.
 */
export function useLab(): LabMembership {
  const lab = useContext(LabContext);
  if (!lab) throw new Error('useLab() is only for screens under labs/:labId (LabLayout provides the lab).');
  return lab;
}
