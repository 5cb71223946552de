import { Button } from './button';

interface PageNavProps {
  /** the page shown, from 1 */
  page: number;
  pages: number;
  onPage: (page: number) => void;
  /** what the navigation is called for a screen reader */
  label?: string;
  /** the words on the two buttons (a mailbox says Newer and Older) */
  back?: string;
  forward?: string;
}

/** Back, "Page n of m", forward under a list that spans pages; nothing when it fits on one. */
export function PageNav({ page, pages, onPage, label = 'Pages', back = 'Previous', forward = 'Next' }: PageNavProps) {
  if (pages <= 1) return null;
  return (
    <nav aria-label={label} className="mt-3 flex items-center gap-3 text-body">
      <Button variant="quiet" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        {back}
      </Button>
      <span>
        Page {page} of {pages}
      </span>
      <Button variant="quiet" disabled={page >= pages} onClick={() => onPage(page + 1)}>
        {forward}
      </Button>
    </nav>
  );
}
