import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { NotesList } from '@/components/notes-list';

describe('NotesList', () => {
  it('when there are notes, then each is one item of a bulleted list, in order', () => {
    render(<NotesList items={['First note.', 'Second note.']} />);
    const list = screen.getByRole('list');
    expect(screen.getAllByRole('listitem').map((item) => item.textContent)).toEqual(['First note.', 'Second note.']);
    expect(list.className).toContain('list-disc');
    expect(list.className).toContain('text-caption');
  });

  it('when there are none, then nothing is drawn (no empty list for a screen reader to announce)', () => {
    const { container } = render(<NotesList items={[]} label="Conversion warnings" />);
    expect(container.innerHTML).toBe('');
  });

  it('when a label, a size and spacing are given, then the list is named, in body text and spaced', () => {
    render(<NotesList items={['A reason.']} size="body" label="Reasons" className="mt-2" />);
    const list = screen.getByRole('list', { name: 'Reasons' });
    expect(list.className.split(' ')).toEqual(expect.arrayContaining(['text-body', 'mt-2']));
    expect(list.className).not.toContain('text-caption');
  });

  it('when the same sentence comes twice, then both are shown', () => {
    render(<NotesList items={['Same.', 'Same.']} />);
    expect(screen.getAllByRole('listitem')).toHaveLength(2);
  });
});
