import { Outlet, useParams } from 'react-router-dom';
import { useSession } from '@/features/auth/api/get-session';
import { NotYourLab } from '@/features/labs/components/not-your-lab';
import { LabContext } from './lab-context';

/**
 * The layout of every address under `labs/:labId`: finds the person's membership in that lab once,
 * answers "not available" for a lab they are not in, and gives the membership to the screen below
 * (`useLab()`). Each screen still checks the role its own actions need.
 */
export function LabLayout() {
  const { labId } = useParams();
  const { user } = useSession();
  const lab = user.labs.find((membership) => membership.labId === labId);
  if (!lab) return <NotYourLab />;
  return (
    <LabContext.Provider value={lab}>
      <Outlet />
    </LabContext.Provider>
  );
}
