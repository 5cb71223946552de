import { useState } from 'react';
import { Button } from './button';

/**
 * A destructive action that takes two clicks: a quiet button asks, then a danger button naming
 * what goes and a button to keep it. The buttons sit in the caller's flex row.
 */
export function ConfirmedAction({
  ask,
  confirm,
  keep = 'Keep it',
  pending,
  pendingLabel,
  onConfirm,
}: {
  /** The first button, e.g. "Discard these spectra". */
  ask: string;
  /** The danger button, naming what goes, e.g. "Discard Matrix A and its file". */
  confirm: string;
  keep?: string;
  pending: boolean;
  pendingLabel?: string;
  onConfirm: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  if (!confirming)
    return (
      <Button variant="quiet" onClick={() => setConfirming(true)}>
        {ask}
      </Button>
    );
  return (
    <>
      <Button variant="danger" pending={pending} pendingLabel={pendingLabel} onClick={onConfirm}>
        {confirm}
      </Button>
      <Button variant="quiet" onClick={() => setConfirming(false)}>
        {keep}
      </Button>
    </>
  );
}
