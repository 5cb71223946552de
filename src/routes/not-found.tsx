import { LinkButton } from '@/components/link-button';
import { paths } from '@/lib/paths';

export function NotFoundRoute() {
  return (
    <div className="max-w-xl space-y-3">
      <h1 className="text-display font-black text-ink-950">Nothing here</h1>
      <p className="text-lead text-ink-700">This address does not lead to a Halflight screen.</p>
      <LinkButton to={paths.overview()}>Back to the overview</LinkButton>
    </div>
  );
}
