import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { PageNav } from '@/components/page-nav';

describe('PageNav', () => {
  it('when everything fits on one page, then there is no page navigation', () => {
    render(<PageNav page={1} pages={1} onPage={() => {}} />);
    expect(screen.queryByRole('navigation')).toBeNull();
  });

  it('when on the first of three pages, then back is off and forward asks for page 2', async () => {
    const onPage = vi.fn();
    render(<PageNav page={1} pages={3} onPage={onPage} label="Pages of messages" back="Newer" forward="Older" />);
    const nav = screen.getByRole('navigation', { name: 'Pages of messages' });
    expect(nav.textContent).toContain('Page 1 of 3');
    expect(screen.getByRole('button', { name: 'Newer' })).toHaveProperty('disabled', true);
    await userEvent.click(screen.getByRole('button', { name: 'Older' }));
    expect(onPage).toHaveBeenCalledWith(2);
  });
});
