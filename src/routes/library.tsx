import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { CompoundRoleHint } from '@shared/schemas/compound-role';
import { PageNav } from '@/components/page-nav';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { SelectField } from '@/components/select-field';
import { Signal } from '@/components/signal';
import { TextField } from '@/components/text-field';
import { useCreateCompound } from '@/features/library/api/create-compound';
import { useCompounds } from '@/features/library/api/get-compounds';
import { CompoundForm } from '@/features/library/components/compound-form';
import { CompoundTable } from '@/features/library/components/compound-table';
import { LibraryImportPanel } from '@/features/library/components/library-import-panel';
import { roleHintLabels } from '@/features/library/components/library-format';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';
import { ScreenHeader } from '@/components/screen-header';
import { Tag } from '@/components/tag';

const pageSize = 25;

/** The lab's compound library: search, filter by role, add a compound, import and export CSV. */
export function LibraryRoute() {
  const lab = useLab();
  return (
    <LibraryScreen labId={lab.labId} labName={lab.labName} isDemo={lab.isDemo} canAdd={can(lab.role, 'library:add')} />
  );
}

function LibraryScreen({
  labId,
  labName,
  isDemo,
  canAdd,
}: {
  labId: string;
  labName: string;
  isDemo: boolean;
  canAdd: boolean;
}) {
  const [search, setSearch] = useState('');
  const [roleHint, setRoleHint] = useState<CompoundRoleHint | ''>('');
  const [page, setPage] = useState(1);
  const compounds = useCompounds(labId, {
    search: search || undefined,
    roleHint: roleHint || undefined,
    page,
    pageSize,
  });
  const create = useCreateCompound(labId);
  const navigate = useNavigate();
  const pages = compounds.data ? Math.max(1, Math.ceil(compounds.data.total / pageSize)) : 1;
  return (
    <div className="max-w-6xl space-y-6">
      <ScreenHeader lab={{ labName, isDemo }} title="Library">
        <p className="mt-1 max-w-3xl text-lead text-ink-700">
          Emitters and quenchers with their redox potentials, lifetimes and E00, kept as reported and read in one
          reference.
        </p>
      </ScreenHeader>
      <Panel
        title="Compounds"
        aside={compounds.data && <Tag tone="neutral">{`${compounds.data.total} in the library`}</Tag>}
      >
        <div className="mb-3 grid gap-3 sm:grid-cols-[2fr_1fr]">
          <TextField
            label="Search by name"
            type="search"
            value={search}
            onChange={(event) => {
              setSearch(event.target.value);
              setPage(1);
            }}
          />
          <SelectField
            label="Role"
            options={[
              { value: '', label: 'All roles' },
              ...Object.entries(roleHintLabels).map(([value, label]) => ({ value, label })),
            ]}
            value={roleHint}
            onChange={(event) => {
              setRoleHint(event.target.value as CompoundRoleHint | '');
              setPage(1);
            }}
          />
        </div>
        {compounds.isPending && <Signal tone="waiting">Loading the library</Signal>}
        {compounds.isError && <ErrorNotice error={compounds.error} what="the library" />}
        {compounds.data && (
          <CompoundTable labId={labId} compounds={compounds.data.items} filtered={Boolean(search || roleHint)} />
        )}
        <PageNav page={page} pages={pages} onPage={setPage} />
      </Panel>
      {canAdd && (
        <Panel title="Add a compound">
          <CompoundForm
            submitLabel="Add compound"
            pending={create.isPending}
            onSave={async (values) => {
              const created = await create.mutateAsync(values);
              await navigate(paths.compound(labId, created.id));
            }}
          />
        </Panel>
      )}
      <Panel title="CSV import and export">
        <LibraryImportPanel labId={labId} canImport={canAdd} />
      </Panel>
    </div>
  );
}
