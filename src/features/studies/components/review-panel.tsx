import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { formatDateTime } from '@shared/format';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { describeError } from '@/lib/form-errors';
import { useAddComment } from '../api/add-comment';
import { useStartRevision } from '../api/start-revision';
import { useSubmitStudy } from '../api/submit-study';
import { notify } from '@/lib/notify';
import { paths } from '@/lib/paths';

const verbs = { submit: 'submitted', approve: 'approved', return: 'returned', comment: 'commented' } as const;

interface Props {
  labId: string;
  study: StudyDetail;
  isOwner: boolean;
  canReview: boolean;
  canWrite: boolean;
}

/** The review thread and the steps this person may take now. */
export function ReviewPanel({ labId, study, isOwner, canReview, canWrite }: Props) {
  const [comment, setComment] = useState('');
  const navigate = useNavigate();
  const submit = useSubmitStudy(labId, study.id);
  const addComment = useAddComment(labId, study.id);
  const revision = useStartRevision(labId, study.id);
  const failed = [submit, addComment, revision].find((mutation) => mutation.isError);
  const done = (message: string) => ({
    onSuccess: () => {
      setComment('');
      notify.done(message);
    },
    onError: (error: unknown) => notify.failed('That did not go through', error),
  });
  const current = study.nextRevisionId === null;

  return (
    <div className="space-y-3">
      <ol className="space-y-2">
        {study.reviews.length === 0 && <li className="text-body text-ink-500">No review steps or comments yet.</li>}
        {study.reviews.map((entry) => (
          <li key={entry.id} className="text-body">
            <strong>{entry.author ?? 'former member'}</strong> {verbs[entry.action]} · {formatDateTime(entry.createdAt)}
            {entry.comment && <span className="block text-ink-700">“{entry.comment}”</span>}
          </li>
        ))}
      </ol>
      {canWrite && current && study.status !== 'approved' && (
        <label className="flex flex-col gap-1 text-body font-bold text-ink-900">
          Comment
          <textarea
            value={comment}
            onChange={(event) => setComment(event.target.value)}
            rows={2}
            className="rounded-md border border-paper-300 px-3 py-2 font-normal"
          />
        </label>
      )}
      {failed && <FormAlert>{describeError(failed.error)}</FormAlert>}
      <div className="flex flex-wrap gap-2">
        {isOwner && current && (study.status === 'draft' || study.status === 'returned') && (
          <Button
            onClick={() => submit.mutate(comment, done('Submitted for review: the lab’s reviewers are told'))}
            pending={submit.isPending}
            disabled={!study.latestFit}
          >
            Submit for review
          </Button>
        )}
        {canReview && current && study.status === 'submitted' && !isOwner && (
          <p className="w-full text-caption text-ink-600">
            Approve or return it in the review bar at the bottom of the window.
          </p>
        )}
        {canWrite && current && study.status !== 'approved' && (
          <Button
            variant="quiet"
            onClick={() => addComment.mutate(comment, done('Comment added'))}
            pending={addComment.isPending}
            disabled={comment.trim() === ''}
          >
            Add comment
          </Button>
        )}
        {(isOwner || canReview) && current && study.status === 'approved' && (
          <Button
            variant="quiet"
            pending={revision.isPending}
            onClick={() => revision.mutate(undefined, { onSuccess: (next) => navigate(paths.study(labId, next.id)) })}
          >
            Start a new revision
          </Button>
        )}
      </div>
    </div>
  );
}
