import { isValidElement, type ReactNode } from 'react';

/** A heading with a class of its own (e.g. `whitespace-nowrap`) beside the table's look. */
export interface Heading {
  label: ReactNode;
  className: string;
}

type Column = ReactNode | Heading;

const isHeading = (column: Column): column is Heading =>
  typeof column === 'object' && column !== null && !isValidElement(column) && 'label' in column;

/**
 * The column headings of a data table, each a `th scope="col"`. Two looks: `spaced` (the library
 * and member lists: padded, bold) and `ruled` (result tables: a rule under the headings, cells
 * spaced on the right). Falsy columns are left out, so an optional column is `canEdit && 'Actions'`.
 */
export function TableHead({
  columns,
  look,
}: {
  columns: (Column | false | null | undefined)[];
  look: 'spaced' | 'ruled';
}) {
  const shown = columns.filter(
    (column): column is Column => column !== false && column !== null && column !== undefined,
  );
  const classFor = (index: number) => {
    if (look === 'spaced') return 'px-3 py-2 text-left text-caption font-bold tracking-wide text-ink-500';
    const last = index === shown.length - 1;
    return [index === 0 ? 'py-2' : '', last ? '' : 'pr-3'].filter(Boolean).join(' ') || undefined;
  };
  return (
    <thead
      className={look === 'ruled' ? 'border-b border-paper-300 text-caption tracking-wide text-ink-500' : undefined}
    >
      <tr>
        {shown.map((column, index) => {
          const heading = isHeading(column) ? column : { label: column, className: '' };
          const className = [classFor(index), heading.className].filter(Boolean).join(' ') || undefined;
          return (
            <th key={index} scope="col" className={className}>
              {heading.label}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}
