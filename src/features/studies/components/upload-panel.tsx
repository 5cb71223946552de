import { useEffect, useRef, useState } from 'react';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { pointValues, type StudyPointInput } from '@shared/schemas/study-points';
import type { UploadMapping, UploadPreview, UploadQuestionCode } from '@shared/schemas/study-uploads';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { notify } from '@/lib/notify';
import { useApplyUpload } from '../api/apply-upload';
import { usePreviewUpload } from '../api/preview-upload';
import { useReplacePoints } from '../api/replace-points';
import { useUploadFile } from '../api/upload-file';
import { FileDrop } from './file-drop';
import { FilePreview } from './file-preview';
import { allAcknowledged } from './upload-questions';

const asInput = (point: StudyDetail['points'][number]): StudyPointInput => pointValues(point);

/**
 * Upload an instrument export (drop or pick), check the table and the mapping, then confirm;
 * nothing reaches the series before that. Points typed by hand are replaced only after a
 * second confirmation, and can be brought back while the page is open.
 */
export function UploadPanel({
  labId,
  study,
  onFitted,
}: {
  labId: string;
  study: StudyDetail;
  /** called when the file's points have been fitted, to bring the result into view */
  onFitted?: () => void;
}) {
  const [preview, setPreview] = useState<UploadPreview | null>(null);
  const [mapping, setMapping] = useState<UploadMapping | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [confirmReplace, setConfirmReplace] = useState(false);
  const [acknowledged, setAcknowledged] = useState<UploadQuestionCode[]>([]);
  const upload = useUploadFile(labId, study.id, setProgress);
  const reread = usePreviewUpload(labId, study.id);
  const apply = useApplyUpload(labId, study.id);
  const restore = useReplacePoints(labId, study.id);
  const typed = study.points.filter((point) => point.uploadId === null);
  const show = (next: UploadPreview) => {
    setPreview(next);
    setMapping(next.mapping);
    setConfirmReplace(false);
    // A tick answers the question about these points; points read another way ask afresh.
    setAcknowledged([]);
  };
  // Focus never drops to the page: a refused file or fit puts it on the message saying why, and
  // setting a file aside puts it back on the file control, the next step (WCAG 2.2, 2.4.3).
  const fileInput = useRef<HTMLInputElement>(null);
  const failure = useRef<HTMLDivElement>(null);
  const failed = upload.error ?? apply.error;
  useEffect(() => {
    if (failed) failure.current?.focus();
  }, [failed]);
  const setAside = () => {
    setPreview(null);
    fileInput.current?.focus();
  };
  const usable = preview !== null && preview.points.length > 0 && allAcknowledged(preview, acknowledged);

  const take = (mode: 'replace' | 'append') => {
    if (!preview || !mapping) return;
    const before = study.points.map(asInput);
    apply.mutate(
      { uploadId: preview.upload.id, version: study.version, mapping, mode, acknowledged },
      {
        onSuccess: (after) => {
          setPreview(null);
          onFitted?.();
          if (mode === 'replace' && typed.length > 0)
            notify.done(`The file’s points replaced ${typed.length} typed by hand`, {
              undoLabel: 'Bring them back',
              undo: () =>
                void restore.mutateAsync({ version: after.version, points: before }).then(
                  () => notify.done('Your typed points are back'),
                  (error: unknown) => notify.failed('They could not be brought back', error),
                ),
            });
        },
        onError: (error) => notify.failed('The file’s points were not taken', error),
      },
    );
  };

  return (
    <div className="space-y-3">
      <FileDrop
        label="Instrument file"
        fileName={preview?.upload.fileName ?? (upload.isPending ? (upload.variables?.name ?? null) : null)}
        progress={upload.isPending ? (progress ?? 0) : null}
        disabled={upload.isPending}
        inputRef={fileInput}
        onFile={(file) => upload.mutate(file, { onSuccess: show, onSettled: () => setProgress(null) })}
      />
      {upload.isPending && <p className="text-body">Reading the file…</p>}
      {upload.isError && (
        <div ref={failure} tabIndex={-1}>
          <FormAlert>{describeError(upload.error)}</FormAlert>
        </div>
      )}
      {preview && mapping && (
        <div className="space-y-3">
          <FilePreview
            fileName={preview.upload.fileName}
            reading={preview}
            mapping={mapping}
            onMapping={(next) => {
              setMapping(next);
              reread.mutate({ uploadId: preview.upload.id, mapping: next }, { onSuccess: show });
            }}
            acknowledged={acknowledged}
            onAcknowledged={setAcknowledged}
          />
          {apply.isError && (
            <div ref={failure} tabIndex={-1}>
              <FormAlert>{describeError(apply.error)}</FormAlert>
            </div>
          )}
          {preview.points.length > 0 && !allAcknowledged(preview, acknowledged) && (
            <p className="text-caption text-ink-600">Tick each check above to use these points.</p>
          )}
          {confirmReplace ? (
            <div role="alertdialog" aria-label="Replace typed points" className="space-y-2 text-body">
              <p className="font-bold">
                This replaces the {typed.length} point{typed.length === 1 ? '' : 's'} typed by hand with the file’s{' '}
                {preview.pointCount}. You can bring them back while this page is open.
              </p>
              <div className="flex flex-wrap gap-2">
                <Button pending={apply.isPending} pendingLabel="Fitting…" onClick={() => take('replace')}>
                  Replace them
                </Button>
                <Button variant="quiet" pending={apply.isPending} onClick={() => take('append')}>
                  Add the file’s points to them
                </Button>
                <Button variant="quiet" onClick={() => setConfirmReplace(false)}>
                  Keep mine
                </Button>
              </div>
            </div>
          ) : (
            <div className="flex flex-wrap gap-2">
              <Button
                pending={apply.isPending}
                pendingLabel="Fitting…"
                disabled={!usable}
                onClick={() => (typed.length > 0 ? setConfirmReplace(true) : take('replace'))}
              >
                Use these points
              </Button>
              {study.points.length > 0 && (
                <Button variant="quiet" pending={apply.isPending} disabled={!usable} onClick={() => take('append')}>
                  Add them to the present points
                </Button>
              )}
              <Button variant="quiet" onClick={setAside}>
                Set aside
              </Button>
            </div>
          )}
        </div>
      )}
    </div>
  );
}
