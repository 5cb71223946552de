import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import type { Session } from '@shared/schemas/auth';
import type { SecondStepNeeded } from '@shared/schemas/two-factor';
import { ErrorNotice } from '@/components/error-notice';
import { Signal } from '@/components/signal';
import { TextLink } from '@/components/text-link';
import { useInvitation } from '@/features/auth/api/get-invitation';
import { needsSecondStep } from '@/features/auth/api/sign-in';
import { AcceptInvitationForm } from '@/features/auth/components/accept-invitation-form';
import { SecondStepForm } from '@/features/auth/components/second-step-form';
import { rememberLab } from '@/features/labs/current-lab';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@shared/format';
import { roleLabels } from '@/lib/role-labels';
import { roleDescriptions } from '@shared/schemas/roles';
import { paths } from '@/lib/paths';
import { PublicScreen } from './public-screen';

/** Answer an invitation from its e-mail link: see who invites you where, then join. */
export function AcceptInvitationRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const invitation = useInvitation(token);
  const [secondStep, setSecondStep] = useState(false);

  if (invitation.isPending) return <Signal tone="waiting">Opening the invitation</Signal>;
  if (invitation.isError) {
    const spent = invitation.error instanceof ApiError && invitation.error.code === 'invitation_invalid';
    return spent ? (
      <PublicScreen
        title="This invitation no longer works"
        lead="It was used, withdrawn or has expired. Ask the lab admin who sent it for a new one."
        footer={<TextLink to={paths.signIn()}>Sign in</TextLink>}
      />
    ) : (
      <ErrorNotice error={invitation.error} what="the invitation" />
    );
  }

  const { labName, role, invitedBy, email, expiresAt } = invitation.data;
  if (secondStep) {
    return (
      <PublicScreen title={`You joined ${labName}`} lead="Your account asks for a code to finish signing in.">
        <SecondStepForm onSignedIn={() => void navigate('/', { replace: true })} />
      </PublicScreen>
    );
  }

  function onJoined(answer: Session | SecondStepNeeded) {
    if (needsSecondStep(answer)) {
      setSecondStep(true);
      return;
    }
    const session = answer;
    // The newest membership with this lab's name is the one just created.
    const joined = session.user.labs.findLast((lab) => lab.labName === labName);
    if (joined) rememberLab(joined.labId);
    void navigate(joined ? paths.members(joined.labId) : paths.overview(), { replace: true });
  }

  return (
    <PublicScreen
      kicker="Invitation"
      title={`Join ${labName}`}
      lead={
        <>
          <strong>{invitedBy}</strong> invites <strong>{email}</strong> to work in this lab as{' '}
          <strong>{roleLabels[role]}</strong>.
        </>
      }
    >
      <dl className="space-y-2 rounded-md bg-paper-100 p-3 text-body">
        <div>
          <dt className="text-caption tracking-wide text-ink-500">What a {roleLabels[role].toLowerCase()} can do</dt>
          <dd className="text-ink-800">{roleDescriptions[role]}</dd>
        </div>
        <div>
          <dt className="text-caption tracking-wide text-ink-500">Link valid until</dt>
          <dd className="text-ink-800">{formatDateTime(expiresAt)}</dd>
        </div>
      </dl>
      <AcceptInvitationForm token={token} invitation={invitation.data} onJoined={onJoined} />
    </PublicScreen>
  );
}
