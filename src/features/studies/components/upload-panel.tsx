import { useState } from 'react';
import type { StudyDetail } from '@shared/schemas/study-detail';
import type { UploadMapping, UploadPreview } from '@shared/schemas/study-uploads';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useApplyUpload } from '../api/apply-upload';
import { usePreviewUpload } from '../api/preview-upload';
import { useUploadFile } from '../api/upload-file';
import { formatNumber } from './format';
import { MappingEditor } from './mapping-editor';

/** Upload an instrument export, check the table and the mapping, then confirm; nothing reaches the series before that. */
export function UploadPanel({ labId, study }: { labId: string; study: StudyDetail }) {
  const [preview, setPreview] = useState<UploadPreview | null>(null);
  const [mapping, setMapping] = useState<UploadMapping | null>(null);
  const upload = useUploadFile(labId, study.id);
  const reread = usePreviewUpload(labId, study.id);
  const apply = useApplyUpload(labId, study.id);
  const show = (next: UploadPreview) => {
    setPreview(next);
    setMapping(next.mapping);
  };

  return (
    <div className="space-y-3">
      <label className="flex flex-col gap-1 text-body font-bold text-ink-900">
        Instrument file (.csv, .tsv, .txt, .dat, .asc, .xlsx or JCAMP-DX .jdx/.dx; up to 20 MB)
        <input
          type="file"
          accept=".csv,.tsv,.txt,.dat,.asc,.xlsx,.jdx,.dx,.jcamp"
          disabled={upload.isPending}
          onChange={(event) => {
            const file = event.target.files?.[0];
            if (file) upload.mutate(file, { onSuccess: show });
            event.target.value = '';
          }}
        />
      </label>
      {upload.isPending && <p className="text-body">Reading the file…</p>}
      {upload.isError && <FormAlert>{describeError(upload.error)}</FormAlert>}
      {preview && mapping && (
        <div className="space-y-3 rounded-md border border-paper-300 p-3">
          <p className="text-body">
            <strong>{preview.upload.fileName}</strong>: {preview.format}, {preview.rowCount} rows.
          </p>
          {/* contain:inline-size: a many-column spectrum matrix scrolls here instead of widening the page */}
          <div className="max-h-48 overflow-auto [contain:inline-size]">
            <table aria-label="Parsed table" className="text-caption">
              <thead>
                <tr>
                  {preview.headers.map((header, i) => (
                    <th key={i} className="px-2 text-left">
                      {header}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {preview.rows.slice(0, 12).map((row, i) => (
                  <tr key={i}>
                    {row.map((cell, j) => (
                      <td key={j} className="px-2">
                        {cell}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <MappingEditor key={preview.upload.id} headers={preview.headers} mapping={mapping} onChange={setMapping} />
          <Button
            variant="quiet"
            pending={reread.isPending}
            onClick={() => reread.mutate({ uploadId: preview.upload.id, mapping }, { onSuccess: show })}
          >
            Read again with this mapping
          </Button>
          {preview.warnings.length > 0 && (
            <FormAlert tone="note">
              {preview.warnings.map((warning) => (
                <p key={warning}>{warning}</p>
              ))}
            </FormAlert>
          )}
          {preview.problems.length > 0 && (
            <FormAlert>
              {preview.problems.map((problem) => (
                <p key={problem.message}>{problem.message}</p>
              ))}
            </FormAlert>
          )}
          {preview.points.length > 0 && (
            <p aria-label="Points from the file" className="text-body">
              {preview.pointCount} points:{' '}
              {preview.points
                .slice(0, 8)
                .map((point) => `${formatNumber(point.concentration)} M → ${formatNumber(point.intensity)}`)
                .join(' · ')}
              {preview.pointCount > 8 ? ' …' : ''}
            </p>
          )}
          {apply.isError && <FormAlert>{describeError(apply.error)}</FormAlert>}
          <div className="flex gap-2">
            <Button
              pending={apply.isPending}
              pendingLabel="Fitting…"
              disabled={preview.points.length === 0}
              onClick={() =>
                apply.mutate(
                  { uploadId: preview.upload.id, version: study.version, mapping, mode: 'replace' },
                  { onSuccess: () => setPreview(null) },
                )
              }
            >
              Use these points
            </Button>
            {study.points.length > 0 && (
              <Button
                variant="quiet"
                pending={apply.isPending}
                disabled={preview.points.length === 0}
                onClick={() =>
                  apply.mutate(
                    { uploadId: preview.upload.id, version: study.version, mapping, mode: 'append' },
                    { onSuccess: () => setPreview(null) },
                  )
                }
              >
                Add them to the present points
              </Button>
            )}
            <Button variant="quiet" onClick={() => setPreview(null)}>
              Set aside
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
