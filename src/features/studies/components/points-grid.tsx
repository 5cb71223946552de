import { useState } from 'react';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { notify } from '@/lib/notify';
import { useReplacePoints } from '../api/replace-points';
import { CONCENTRATION_UNITS, fromSi, unitLabel } from '@shared/units/units';
import { ConcentrationUnitField } from './concentration-unit-field';
import { formatNumber, type GridConcentrationUnit } from './format';
import { TableScroll } from '@/components/table-scroll';
import {
  emptyRow,
  gridColumns,
  pasteInto,
  pointsFromRows,
  rowsFromPoints,
  savedPointOf,
  type GridRow,
} from './points-grid-model';

interface Props {
  labId: string;
  study: StudyDetail;
  editable: boolean;
}

/** Rows of the grid on one page. */
export const gridPageSize = 50;

/** The series as an editable table; paste a block from a spreadsheet into any cell. Corrected values sit beside the raw ones. */
export function PointsGrid({ labId, study, editable }: Props) {
  if (!editable) return <PointsTable study={study} />;
  return <EditablePointsGrid labId={labId} study={study} />;
}

/** A study that cannot change (locked, or not the reader's): the points as a plain table, nothing to type in. */
function PointsTable({ study }: { study: StudyDetail }) {
  if (study.points.length === 0) return <p className="text-body text-ink-500">No points.</p>;
  return (
    <div className="overflow-x-auto [contain:inline-size]">
      <table aria-label="Points" className="w-full text-left text-body tabular-nums">
        <thead className="text-caption text-ink-500">
          <tr>
            <th scope="col">#</th>
            <th scope="col">[Q] ({unitLabel('mM')})</th>
            <th scope="col">{study.dataKind === 'ratio' ? 'I0/I' : 'Intensity'}</th>
            <th scope="col">Lifetime (ns)</th>
            <th scope="col">A at λex</th>
            <th scope="col">A at λem</th>
            <th scope="col">Used</th>
          </tr>
        </thead>
        <tbody>
          {study.points.map((point) => (
            <tr key={point.id} className={point.excluded ? 'text-ink-500' : ''}>
              <td>{point.position + 1}</td>
              <td>{formatNumber(fromSi(point.concentration, 'mM'), 4)}</td>
              <td>{formatNumber(point.intensity, 5)}</td>
              <td>{point.lifetime === null ? '—' : formatNumber(fromSi(point.lifetime, 'ns'), 4)}</td>
              <td>{formatNumber(point.absorbanceExcitation)}</td>
              <td>{formatNumber(point.absorbanceEmission)}</td>
              <td>{point.excluded ? `left out${point.exclusionReason ? `: ${point.exclusionReason}` : ''}` : 'yes'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function EditablePointsGrid({ labId, study }: Omit<Props, 'editable'>) {
  const editable = true;
  const [unit, setUnit] = useState<GridConcentrationUnit>('mM');
  const [rows, setRows] = useState<GridRow[]>(() => [...rowsFromPoints(study.points, 'mM'), emptyRow()]);
  const [problems, setProblems] = useState<string[]>([]);
  const [page, setPage] = useState(0);
  const save = useReplacePoints(labId, study.id);
  const corrections = study.dilutionCorrection || study.innerFilterCorrection;
  const savedById = new Map(study.points.map((point) => [point.id, point]));
  const hasValues = (row: GridRow) => gridColumns.some(({ key }) => row[key].trim() !== '');
  const correctedCell = (row: GridRow) => {
    if (!hasValues(row)) return '';
    const corrected = savedPointOf(row, savedById, unit)?.corrected;
    if (corrected === undefined) return <span className="text-ink-500">after saving</span>;
    return corrected ? `${formatNumber(corrected.concentration)} M / ${formatNumber(corrected.intensity)}` : '';
  };
  const waiting = corrections && rows.some((row) => hasValues(row) && !savedPointOf(row, savedById, unit));

  function changeUnit(next: GridConcentrationUnit) {
    const ratio = CONCENTRATION_UNITS[unit] / CONCENTRATION_UNITS[next];
    setRows((current) =>
      current.map((row) => {
        const value = Number(row.concentration.replace(',', '.'));
        return row.concentration.trim() === '' || !Number.isFinite(value)
          ? row
          : { ...row, concentration: String(Number((value * ratio).toPrecision(10))) };
      }),
    );
    setUnit(next);
  }
  function onSave() {
    const { points, problems: found } = pointsFromRows(rows, unit);
    setProblems(found);
    if (found.length === 0)
      // mutateAsync: the grid is keyed by the saved points and starts afresh once they change,
      // and a replaced component's mutate callbacks never run; the promise still settles.
      void save.mutateAsync({ version: study.version, points }).then(
        (saved) => {
          setRows([...rowsFromPoints(saved.points, unit), emptyRow()]);
          notify.done(saved.latestFit ? 'Points saved and fitted' : 'Points saved');
        },
        (error: unknown) => notify.failed('The points were not saved', error),
      );
  }
  const set = (index: number, patch: Partial<GridRow>) =>
    setRows((current) => current.map((row, i) => (i === index ? { ...row, ...patch } : row)));
  // A long series is shown a page of rows at a time: 400 rows of inputs at once made the screen stall.
  const pages = Math.max(1, Math.ceil(rows.length / gridPageSize));
  const shownPage = Math.min(page, pages - 1);
  const first = shownPage * gridPageSize;
  const shown = rows.slice(first, first + gridPageSize);
  const pager = pages > 1 && (
    <nav aria-label="Pages of points" className="flex flex-wrap items-center gap-2 text-body">
      <Button variant="quiet" disabled={shownPage === 0} onClick={() => setPage(shownPage - 1)}>
        Previous rows
      </Button>
      <span aria-live="polite">
        Rows {first + 1}–{first + shown.length} of {rows.length}
      </span>
      <Button variant="quiet" disabled={shownPage >= pages - 1} onClick={() => setPage(shownPage + 1)}>
        Next rows
      </Button>
    </nav>
  );

  return (
    <div className="space-y-3">
      <div className="flex items-end gap-4">
        <ConcentrationUnitField label="Concentration unit" value={unit} onChange={changeUnit} />
        <p className="pb-2 text-caption text-ink-500">
          {study.dataKind === 'ratio'
            ? 'The intensity column holds I0/I ratios.'
            : 'Paste a block of cells copied from a spreadsheet into any cell.'}
        </p>
      </div>
      {/* contain:inline-size: with the corrected column the grid scrolls here instead of widening the page */}
      <TableScroll label="Points, scroll sideways" className="[contain:inline-size]">
        <table className="w-full text-body">
          <thead>
            <tr className="text-left text-caption text-ink-500">
              <th>#</th>
              {gridColumns.map((column) => (
                <th key={column.key}>{column.key === 'concentration' ? `[Q] (${unitLabel(unit)})` : column.label}</th>
              ))}
              <th>Leave out</th>
              <th>Reason</th>
              {corrections && <th>Corrected [Q] / I</th>}
            </tr>
          </thead>
          <tbody>
            {shown
              .map((row, shownIndex) => ({ row, index: first + shownIndex }))
              .map(({ row, index }) => (
                <tr key={index} className={row.excluded ? 'bg-brick-100/50' : ''}>
                  <td className="pr-2 text-caption text-ink-500">{index + 1}</td>
                  {gridColumns.map((column, columnIndex) => (
                    <td key={column.key} className="pr-1">
                      <input
                        aria-label={`Row ${index + 1} ${column.label}`}
                        disabled={!editable}
                        value={row[column.key]}
                        className="w-24 rounded border border-paper-300 px-1.5 py-1"
                        onChange={(event) => set(index, { [column.key]: event.target.value })}
                        onPaste={(event) => {
                          const text = event.clipboardData.getData('text');
                          if (!/[\t\n]/.test(text)) return;
                          event.preventDefault();
                          setRows((current) => [
                            ...pasteInto(current, text, index, columnIndex).filter(
                              (r, i, all) =>
                                i < all.length - 1 || Object.values(r).some((v) => v !== '' && v !== false),
                            ),
                            emptyRow(),
                          ]);
                        }}
                      />
                    </td>
                  ))}
                  <td>
                    <input
                      type="checkbox"
                      aria-label={`Row ${index + 1} leave out`}
                      disabled={!editable}
                      checked={row.excluded}
                      onChange={(event) => set(index, { excluded: event.target.checked })}
                    />
                  </td>
                  <td>
                    <input
                      aria-label={`Row ${index + 1} reason`}
                      disabled={!editable || !row.excluded}
                      value={row.exclusionReason}
                      className="w-36 rounded border border-paper-300 px-1.5 py-1"
                      onChange={(event) => set(index, { exclusionReason: event.target.value })}
                    />
                  </td>
                  {corrections && <td className="text-caption text-ink-700">{correctedCell(row)}</td>}
                </tr>
              ))}
          </tbody>
        </table>
      </TableScroll>
      {pager}
      {waiting && (
        <p className="text-caption text-ink-500">
          Corrected values are worked out on the server from saved points; new and changed rows show theirs after
          saving.
        </p>
      )}
      {problems.length > 0 && (
        <FormAlert>
          {problems.map((problem) => (
            <p key={problem}>{problem}</p>
          ))}
        </FormAlert>
      )}
      {save.isError && <FormAlert>{describeError(save.error)}</FormAlert>}
      {editable && (
        <div className="flex gap-2">
          <Button onClick={onSave} pending={save.isPending} pendingLabel="Saving and fitting…">
            Save points and fit
          </Button>
          <Button
            variant="quiet"
            onClick={() => {
              setRows((current) => [...current, emptyRow()]);
              setPage(Math.floor(rows.length / gridPageSize));
            }}
          >
            Add a row
          </Button>
        </div>
      )}
    </div>
  );
}
