import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { TableHead } from '@/components/table-head';

const headings = () => screen.getAllByRole('columnheader');

describe('TableHead', () => {
  it('when a column is optional and off, then it is left out and the others stay column headers', () => {
    const canManage = false;
    render(
      <table>
        <TableHead
          look="spaced"
          columns={['Name', { label: 'Member since', className: 'whitespace-nowrap' }, canManage && 'Actions']}
        />
      </table>,
    );
    expect(headings().map((cell) => cell.textContent)).toEqual(['Name', 'Member since']);
    expect(headings().every((cell) => cell.getAttribute('scope') === 'col')).toBe(true);
    expect(headings()[1]!.className).toContain('whitespace-nowrap');
  });

  it('when the look is ruled, then only the first heading pads the row and the last has no right spacing', () => {
    render(
      <table>
        <TableHead look="ruled" columns={['Step', 'Target', 'Reached']} />
      </table>,
    );
    expect(headings().map((cell) => cell.className)).toEqual(['py-2 pr-3', 'pr-3', '']);
  });
});
