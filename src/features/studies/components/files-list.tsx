import { formatDateTime } from '@shared/format';
import type { UploadSummary } from '@shared/schemas/study-detail';
import { EmptyState } from '@/components/empty-state';

const statusWords = { parsed: 'read, not used yet', failed: 'could not be read', applied: 'points taken' } as const;

/** Raw files as received, each downloadable again. */
export function FilesList({
  labId,
  studyId,
  uploads,
  editable,
}: {
  labId: string;
  studyId: string;
  uploads: UploadSummary[];
  /** false for a locked study or another person's: nothing to invite, only what is kept */
  editable: boolean;
}) {
  if (uploads.length === 0)
    return editable ? (
      <EmptyState title="No files yet">Upload an instrument export to keep it with the study.</EmptyState>
    ) : (
      <p className="text-body text-ink-500">No instrument files were kept with this study.</p>
    );
  return (
    <ul className="space-y-2 text-body">
      {uploads.map((upload) => (
        <li key={upload.id}>
          <a
            className="font-bold text-ink-800 underline"
            href={`/api/labs/${labId}/studies/${studyId}/uploads/${upload.id}/file`}
            download
          >
            {upload.fileName}
          </a>
          <span className="text-ink-500">
            {' '}
            · {(upload.size / 1024).toFixed(1)} kB · {statusWords[upload.parseStatus]} ·{' '}
            {upload.uploadedBy ?? 'former member'}, {formatDateTime(upload.createdAt)}
          </span>
          {upload.problem && <span className="block text-caption text-brick-700">{upload.problem}</span>}
          <span className="block truncate text-caption text-ink-600" title="SHA-256">
            {upload.sha256}
          </span>
        </li>
      ))}
    </ul>
  );
}
