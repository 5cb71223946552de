import { Panel } from '@/components/panel';
import { TextLink } from '@/components/text-link';
import { paths } from '@/lib/paths';
import { useSession } from '@/features/auth/api/get-session';
import { PasswordForm } from '@/features/auth/components/password-form';
import { ProfileForm } from '@/features/auth/components/profile-form';
import { TwoFactorPanel } from '@/features/auth/components/two-factor-panel';
import { ScreenHeader } from '@/components/screen-header';

/** The signed-in person's own details: name, password, two-step sign-in and open sessions. */
export function AccountRoute() {
  const session = useSession();
  const { user } = session;
  return (
    <div className="max-w-2xl space-y-6">
      <ScreenHeader title="Account">
        <p className="mt-1 text-lead text-ink-700">How you appear to your labs, and how you sign in.</p>
      </ScreenHeader>
      <Panel title="Your name">
        <ProfileForm name={user.name} email={user.email} />
      </Panel>
      <Panel title="Password">
        <PasswordForm />
      </Panel>
      <Panel title="Two-step sign-in">
        <TwoFactorPanel session={session} />
      </Panel>
      <Panel title="Where you are signed in">
        <p className="text-body text-ink-700">
          See every browser signed in as you, and sign out the ones you do not recognise:{' '}
          <TextLink to={paths.accountSessions()}>signed-in browsers</TextLink>.
        </p>
      </Panel>
    </div>
  );
}
