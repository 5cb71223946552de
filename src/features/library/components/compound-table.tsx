import type { CompoundSummary } from '@shared/schemas/library';
import { EmptyState } from '@/components/empty-state';
import { Tag } from '@/components/tag';
import { TextLink } from '@/components/text-link';
import { roleHintLabels } from './library-format';
import { paths } from '@/lib/paths';
import { TableHead } from '@/components/table-head';
import { TableScroll } from '@/components/table-scroll';

/** One page of the library; each name opens the compound. */
export function CompoundTable({
  labId,
  compounds,
  filtered,
}: {
  labId: string;
  compounds: CompoundSummary[];
  filtered: boolean;
}) {
  if (compounds.length === 0) {
    return filtered ? (
      <EmptyState title="No compound matches.">Try another part of the name or another role.</EmptyState>
    ) : (
      <EmptyState title="The library is empty.">
        Add a compound, or import a CSV file of compounds and potentials.
      </EmptyState>
    );
  }
  const cell = 'px-3 py-2.5';
  return (
    <TableScroll label="Compounds, scroll sideways">
      <table className="w-full text-body">
        <TableHead
          look="spaced"
          columns={['Compound', 'Used as', 'Emissive state', 'Potentials', 'Lifetimes', 'E00']}
        />
        <tbody>
          {compounds.map((compound) => (
            <tr key={compound.id} className="border-t border-paper-200">
              <td className={cell}>
                <TextLink to={paths.compound(labId, compound.id)}>{compound.name}</TextLink>
              </td>
              <td className={cell}>
                <Tag>{roleHintLabels[compound.roleHint]}</Tag>
              </td>
              <td className={`${cell} text-ink-700`}>{compound.emissiveState ?? '—'}</td>
              <td className={cell}>{compound.counts.potentials}</td>
              <td className={cell}>{compound.counts.lifetimes}</td>
              <td className={cell}>{compound.counts.energies}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}
