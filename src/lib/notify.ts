import { toast } from 'sonner';
import { describeError } from './form-errors';

/**
 * Short notices for what just happened (saved, submitted, approved, failed), shown in the corner
 * and read out by screen readers through the notice area's live region (src/components/notice-area.tsx).
 * Failures stay until dismissed; the rest fade after a few seconds.
 */
export const notify = {
  done: (message: string, options?: { undo?: () => void; undoLabel?: string }) =>
    toast.success(message, {
      ...(options?.undo
        ? { action: { label: options.undoLabel ?? 'Undo', onClick: options.undo }, duration: 10_000 }
        : {}),
    }),
  note: (message: string) => toast(message),
  failed: (what: string, error: unknown) => toast.error(`${what}: ${describeError(error)}`, { duration: Infinity }),
};
