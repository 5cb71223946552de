import { TextLink } from '@/components/text-link';
import { paths } from '@/lib/paths';

/** Shown for a lab address the person does not belong to (or a screen their role does not open). */
export function NotYourLab({ reason = 'You are not a member of this lab.' }: { reason?: string }) {
  return (
    <div className="max-w-xl space-y-3">
      <h1 className="text-display font-black text-ink-950">Not available</h1>
      <p className="text-lead text-ink-700">{reason}</p>
      <TextLink to={paths.overview()}>Back to the overview</TextLink>
    </div>
  );
}
