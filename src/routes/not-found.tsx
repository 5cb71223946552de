import { Link } from 'react-router-dom';
import { paths } from '@/lib/paths';

export function NotFoundRoute() {
  return (
    <div className="max-w-xl space-y-3">
      <h1 className="text-display font-black text-ink-950">Nothing here</h1>
      <p className="text-lead text-ink-700">This address does not lead to a Halflight screen.</p>
      <Link
        to={paths.overview()}
        className="inline-block rounded-md bg-glow-400 px-4 py-2 font-bold text-ink-950 hover:bg-glow-300"
      >
        Back to the overview
      </Link>
    </div>
  );
}
