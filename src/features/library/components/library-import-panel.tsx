import { useState } from 'react';
import { libraryCsvColumns } from '@shared/schemas/library-import';
import type { ImportReport } from '@shared/schemas/library-import';
import { Button } from '@/components/button';
import { FileField } from '@/components/file-field';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { libraryExportUrl, useImportLibrary } from '../api/import-library';
import { TableScroll } from '@/components/table-scroll';

/** Check a CSV file first (every problem by row and column), then import it whole or not at all. */
export function LibraryImportPanel({ labId, canImport }: { labId: string; canImport: boolean }) {
  const importer = useImportLibrary(labId);
  const [csv, setCsv] = useState<string | null>(null);
  const [fileName, setFileName] = useState('');
  const [report, setReport] = useState<ImportReport | null>(null);

  async function choose(file: File) {
    setReport(null);
    setFileName(file.name);
    const text = await file.text();
    setCsv(text);
    importer.mutate({ csv: text, dryRun: true }, { onSuccess: setReport });
  }

  const total = report ? Object.values(report.counts).reduce((sum, count) => sum + count, 0) : 0;
  return (
    <div className="space-y-3 text-body">
      <p className="text-ink-700">
        <a
          className="font-bold text-ink-800 underline decoration-glow-400 underline-offset-4"
          href={libraryExportUrl(labId)}
          download
        >
          Download the library as CSV
        </a>{' '}
        — one row per compound, potential, lifetime or E00; the same columns import back.
      </p>
      {canImport && (
        <>
          <FileField
            label="CSV file to import"
            accept=".csv,text/csv"
            fileName={fileName || null}
            disabled={importer.isPending}
            onFile={(file) => void choose(file)}
            hint={`Columns: ${libraryCsvColumns.join(', ')}. Potentials in V, lifetimes in s, E00 in eV or nm. Files separated by semicolons may use decimal commas (1,21).`}
          />
          {importer.isError && <FormAlert>{describeError(importer.error)}</FormAlert>}
          {report && report.problems.length > 0 && (
            <div role="region" aria-label="Problems in the file" className="space-y-1">
              <FormAlert>
                {fileName}: {report.problems.length === 1 ? '1 problem' : `${report.problems.length} problems`}; nothing
                will be saved until the file is fixed.
              </FormAlert>
              <TableScroll label="Rows to import, scrolls sideways">
                <table className="w-full text-caption">
                  <thead>
                    <tr>
                      <th className="px-2 py-1 text-left">Row</th>
                      <th className="px-2 py-1 text-left">Column</th>
                      <th className="px-2 py-1 text-left">Reason</th>
                    </tr>
                  </thead>
                  <tbody>
                    {report.problems.map((problem, index) => (
                      <tr key={index} className="border-t border-paper-200">
                        <td className="px-2 py-1">{problem.row}</td>
                        <td className="px-2 py-1">{problem.column || '—'}</td>
                        <td className="px-2 py-1">{problem.reason}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </TableScroll>
            </div>
          )}
          {report && report.problems.length === 0 && !report.saved && csv && (
            <div className="flex flex-wrap items-center gap-3">
              <FormAlert tone="note">
                {fileName} is valid: {report.counts.compounds} compounds, {report.counts.potentials} potentials,{' '}
                {report.counts.lifetimes} lifetimes, {report.counts.energies} E00.
              </FormAlert>
              <Button
                pending={importer.isPending}
                pendingLabel="Importing…"
                onClick={() => importer.mutate({ csv }, { onSuccess: setReport })}
              >
                Import {total} records
              </Button>
            </div>
          )}
          {report?.saved && (
            <FormAlert tone="good">
              Imported {total} records from {fileName}.
            </FormAlert>
          )}
        </>
      )}
    </div>
  );
}
