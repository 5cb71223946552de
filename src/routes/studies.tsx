import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { ListStudiesQuery } from '@shared/schemas/studies';
import { studyStatuses } from '@shared/schemas/studies';
import { EmptyState } from '@/components/empty-state';
import { ErrorNotice } from '@/components/error-notice';
import { Panel } from '@/components/panel';
import { SelectField } from '@/components/select-field';
import { LinkButton } from '@/components/link-button';
import { ScreenHeader } from '@/components/screen-header';
import { TextField } from '@/components/text-field';
import { useStudies } from '@/features/studies/api/get-studies';
import { useStudyFormOptions } from '@/features/studies/api/get-study-form-options';
import { formatDate, formatNumber } from '@shared/format';
import { statusLabels } from '@/features/studies/components/format';
import { StatusSignal } from '@/features/studies/components/status-signal';
import { paths } from '@/lib/paths';
import { can } from '@/lib/policy';
import { useLab } from '@/routes/lab-context';
import { TableScroll } from '@/components/table-scroll';

const FILTERS = [
  'emitterId',
  'quencherId',
  'solventId',
  'status',
  'ownerId',
  'flagged',
  'q',
  'sort',
  'direction',
  'page',
  'cursor',
] as const;

/** The lab's studies, filtered, sorted and paged on the server; the filters live in the address. */
export function StudiesRoute() {
  const lab = useLab();
  const labId = lab.labId;
  const [params, setParams] = useSearchParams();
  const [text, setText] = useState(params.get('q') ?? '');
  const filters = Object.fromEntries(
    FILTERS.flatMap((key) => (params.get(key) ? [[key, params.get(key)]] : [])),
  ) as Partial<ListStudiesQuery>;
  const studies = useStudies(labId, filters);
  const options = useStudyFormOptions(labId);
  const set = (key: (typeof FILTERS)[number], value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    if (key !== 'page') {
      next.delete('page');
      next.delete('cursor');
    }
    setParams(next);
  };
  /**
   * Pages go by the cursors the server gives (a deep page costs what the first does); the page
   * number rides along in the address only to be shown. Page 1 is the plain list again.
   */
  const turn = (to: number, cursor: string | null) => {
    const next = new URLSearchParams(params);
    if (to <= 1 || !cursor) {
      next.delete('page');
      next.delete('cursor');
    } else {
      next.set('page', String(to));
      next.set('cursor', cursor);
    }
    setParams(next);
  };
  const select = (
    key: (typeof FILTERS)[number],
    label: string,
    choices: Array<{ value: string; label: string }>,
    none = 'all',
  ) => (
    <SelectField
      label={label}
      value={params.get(key) ?? ''}
      onChange={(event) => set(key, event.target.value)}
      options={[{ value: '', label: none }, ...choices]}
    />
  );
  const compounds = options.data?.compounds ?? [];
  const page = Number(params.get('page') ?? 1);
  const pages = studies.data ? Math.max(1, Math.ceil(studies.data.total / studies.data.pageSize)) : 1;
  // Counting stops at 10,000 matches: past that the screen says so instead of a made-up number.
  const counted = studies.data
    ? studies.data.totalCapped
      ? `More than ${studies.data.total.toLocaleString('en-GB')} studies`
      : `${studies.data.total.toLocaleString('en-GB')} ${studies.data.total === 1 ? 'study' : 'studies'}`
    : '';
  return (
    <div className="max-w-6xl space-y-6">
      <ScreenHeader
        lab={lab}
        title="Studies"
        action={can(lab.role, 'studies:write') && <LinkButton to={paths.newStudy(labId)}>New study</LinkButton>}
      />
      <Panel title="Find">
        <form
          className="grid grid-cols-2 gap-3 md:grid-cols-4"
          onSubmit={(event) => {
            event.preventDefault();
            set('q', text.trim());
          }}
        >
          <TextField
            label="Words in title or notes"
            value={text}
            onChange={(event) => setText(event.target.value)}
            onBlur={() => set('q', text.trim())}
          />
          {select(
            'emitterId',
            'Emitter',
            compounds.filter((c) => c.roleHint !== 'quencher').map((c) => ({ value: c.id, label: c.name })),
          )}
          {select(
            'quencherId',
            'Quencher',
            compounds.filter((c) => c.roleHint !== 'photocatalyst').map((c) => ({ value: c.id, label: c.name })),
          )}
          {select(
            'solventId',
            'Solvent',
            (options.data?.solvents ?? []).map((s) => ({ value: s.id, label: s.name })),
          )}
          {select(
            'status',
            'Status',
            studyStatuses.map((s) => ({ value: s, label: statusLabels[s] })),
          )}
          {select(
            'ownerId',
            'Owner',
            (options.data?.members ?? []).map((m) => ({ value: m.userId, label: m.name })),
          )}
          {select('flagged', 'Flags', [{ value: 'true', label: 'flagged only' }])}
          {select(
            'sort',
            'Sort by',
            [
              { value: 'kq', label: 'kq, highest first' },
              { value: 'k_sv', label: 'K_SV, highest first' },
            ],
            'last changed',
          )}
        </form>
      </Panel>
      {studies.isError && <ErrorNotice error={studies.error} what="the studies" />}
      {studies.data && studies.data.items.length === 0 && (
        <EmptyState title="No studies match">Change the filters, or start a new study.</EmptyState>
      )}
      {studies.data && studies.data.items.length > 0 && (
        <Panel title={counted}>
          <TableScroll label="Studies, scrolls sideways">
            <table className="w-full text-body">
              <thead>
                <tr className="text-left text-caption text-ink-500">
                  <th>Title</th>
                  <th>Emitter → quencher</th>
                  <th>Solvent</th>
                  <th>K_SV (M⁻¹)</th>
                  <th>kq (M⁻¹ s⁻¹)</th>
                  <th>Status</th>
                  <th>Owner</th>
                  <th>Changed</th>
                </tr>
              </thead>
              <tbody>
                {studies.data.items.map((study) => (
                  <tr key={study.id} className="border-t border-paper-200">
                    <td className="py-2">
                      <Link className="font-bold text-ink-900 underline" to={paths.study(labId, study.id)}>
                        {study.title}
                      </Link>
                      {study.revision > 1 && <span className="text-caption text-ink-500"> rev. {study.revision}</span>}
                    </td>
                    <td>
                      {study.emitter.name} → {study.quencher.name}
                    </td>
                    <td>{study.solventLabel}</td>
                    <td>{formatNumber(study.kSv)}</td>
                    <td>
                      {formatNumber(study.kq)}
                      {study.flagged && <span className="ml-1 text-caption font-bold text-brick-700">flagged</span>}
                    </td>
                    <td>
                      <StatusSignal status={study.status} />
                    </td>
                    <td>{study.ownerName}</td>
                    <td className="text-caption">{formatDate(study.updatedAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
          <nav aria-label="Pages" className="mt-3 flex items-center gap-3 text-body">
            <button
              type="button"
              disabled={page <= 1 && !studies.data.previousCursor}
              onClick={() => turn(page - 1, studies.data.previousCursor)}
              className="underline disabled:opacity-40"
            >
              Previous
            </button>
            <span>
              Page {page.toLocaleString('en-GB')}
              {studies.data.totalCapped ? '' : ` of ${pages.toLocaleString('en-GB')}`}
            </span>
            <button
              type="button"
              disabled={!studies.data.nextCursor}
              onClick={() => turn(page + 1, studies.data.nextCursor)}
              className="underline disabled:opacity-40"
            >
              Next
            </button>
          </nav>
        </Panel>
      )}
    </div>
  );
}
