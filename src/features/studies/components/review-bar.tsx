import { useState } from 'react';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { Button } from '@/components/button';
import { notify } from '@/lib/notify';
import { useApproveStudy } from '../api/approve-study';
import { useReturnStudy } from '../api/return-study';

/**
 * The reviewer's decision, kept at the bottom of the window while they read the study: approve
 * (after a confirmation that restates every flag) or return with a comment.
 */
export function ReviewBar({ labId, study }: { labId: string; study: StudyDetail }) {
  const [comment, setComment] = useState('');
  const [confirming, setConfirming] = useState(false);
  const approve = useApproveStudy(labId, study.id);
  const giveBack = useReturnStudy(labId, study.id);
  const flags = study.latestFit?.result.flags ?? [];
  const failed = (error: unknown) => notify.failed('That did not go through', error);
  return (
    <aside
      aria-label="Review"
      className="sticky bottom-0 z-10 -mx-2 rounded-t-card border border-ink-300 bg-paper-50 px-4 py-3 shadow-card"
    >
      {confirming ? (
        <div role="alertdialog" aria-label="Confirm approval" className="space-y-2 text-body">
          <p className="font-bold">
            Approve “{study.title}” and lock it?
            {flags.length === 0 ? ' The fit carries no flag.' : ` The fit carries ${flags.length} flag(s):`}
          </p>
          {flags.length > 0 && (
            <ul className="list-disc pl-5">
              {flags.map((flag) => (
                <li key={flag.code}>
                  <strong>{flag.title}</strong>
                  {flag.detail ? ` (${flag.detail})` : ''}
                </li>
              ))}
            </ul>
          )}
          <div className="flex gap-2">
            <Button
              pending={approve.isPending}
              onClick={() =>
                // mutateAsync: the bar leaves the screen once the study is approved, and a leaving
                // component's mutate callbacks never run; the promise still settles.
                approve.mutateAsync(comment).then(() => notify.done('Approved: the study is locked'), failed)
              }
            >
              {flags.length > 0 ? 'Approve with these flags' : 'Approve'}
            </Button>
            <Button variant="quiet" onClick={() => setConfirming(false)}>
              Not yet
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-wrap items-end gap-3">
          <label className="flex min-w-64 flex-1 flex-col gap-1 text-body font-bold text-ink-900">
            Review comment
            <input
              value={comment}
              onChange={(event) => setComment(event.target.value)}
              className="rounded-md border border-ink-300 px-3 py-1.5 font-normal"
              placeholder="Needed to return; optional to approve"
            />
          </label>
          <Button onClick={() => setConfirming(true)}>Approve…</Button>
          <Button
            variant="danger"
            disabled={comment.trim() === ''}
            title="Say what should change"
            pending={giveBack.isPending}
            onClick={() =>
              giveBack
                .mutateAsync(comment)
                .then(() => notify.done(`Returned to ${study.ownerName} with your comment`), failed)
            }
          >
            Return with comment
          </Button>
        </div>
      )}
    </aside>
  );
}
