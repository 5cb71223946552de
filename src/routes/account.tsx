import { Panel } from '@/components/panel';
import { TextLink } from '@/components/text-link';
import { useSession } from '@/features/auth/api/get-session';
import { PasswordForm } from '@/features/auth/components/password-form';
import { ProfileForm } from '@/features/auth/components/profile-form';

/** The signed-in person's own details: their name and their password. */
export function AccountRoute() {
  const { user } = useSession();
  return (
    <div className="max-w-2xl space-y-6">
      <header>
        <h1 className="text-display font-black text-ink-950">Account</h1>
        <p className="mt-1 text-lead text-ink-700">How you appear to your labs, and how you sign in.</p>
      </header>
      <Panel title="Your name">
        <ProfileForm name={user.name} email={user.email} />
      </Panel>
      <Panel title="Password">
        <PasswordForm />
      </Panel>
      <Panel title="Where you are signed in">
        <p className="text-body text-ink-700">
          See every browser signed in as you, and sign out the ones you do not recognise:{' '}
          <TextLink to="/account/sessions">signed-in browsers</TextLink>.
        </p>
      </Panel>
    </div>
  );
}
