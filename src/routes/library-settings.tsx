import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { useSession } from '@/features/auth/api/get-session';
import { NotYourLab } from '@/features/labs/components/not-your-lab';
import { SignInRulesForm } from '@/features/labs/components/sign-in-rules-form';
import { useLabSettings } from '@/features/library/api/get-lab-settings';
import { LabSettingsForm } from '@/features/library/components/lab-settings-form';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';
import { ScreenHeader } from '@/components/screen-header';

/** Lab settings for admins: the reference electrode in which potentials are read, and sign-in rules. */
export function LibrarySettingsRoute() {
  const lab = useLab();
  const session = useSession();
  if (!can(lab.role, 'settings:manage')) return <NotYourLab reason="Only the lab's admins change its settings." />;
  return (
    <SettingsScreen
      labId={lab.labId}
      labName={lab.labName}
      requireTwoFactor={lab.requireTwoFactor}
      ownTwoFactor={session.twoFactor.enabled}
    />
  );
}

interface SettingsScreenProps {
  labId: string;
  labName: string;
  requireTwoFactor: boolean;
  ownTwoFactor: boolean;
}

function SettingsScreen({ labId, labName, requireTwoFactor, ownTwoFactor }: SettingsScreenProps) {
  const settings = useLabSettings(labId);
  return (
    <div className="max-w-4xl space-y-6">
      <ScreenHeader lab={{ labName }} title="Lab settings">
        <p className="mt-1 text-lead text-ink-700">
          Potentials are stored exactly as entered and shown converted into this reference, with the original beside
          them. IUPAC recommends Fc+/Fc for work in organic solvents; aqueous references there carry a
          junction-potential error.
        </p>
      </ScreenHeader>
      <Panel title="Display reference">
        {settings.isPending && <Signal tone="waiting">Loading settings</Signal>}
        {settings.isError && <ErrorNotice error={settings.error} what="the settings" />}
        {settings.data && <LabSettingsForm labId={labId} settings={settings.data} />}
      </Panel>
      <Panel title="Sign-in rules">
        <SignInRulesForm labId={labId} requireTwoFactor={requireTwoFactor} ownTwoFactor={ownTwoFactor} />
      </Panel>
    </div>
  );
}
