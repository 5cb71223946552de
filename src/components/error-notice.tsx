import { ApiError } from '@/lib/api-client';

/** Explains a failed load in plain words, with the server's own message when there is one. */
export function ErrorNotice({ error, what }: { error: unknown; what: string }) {
  const message =
    error instanceof ApiError
      ? error.message
      : error instanceof Error
        ? error.message
        : 'An unexpected problem occurred.';
  return (
    <div role="alert" className="rounded-card border border-brick-500/40 bg-brick-100 p-4 text-body text-brick-700">
      <p className="font-bold">Could not load {what}.</p>
      <p>{message}</p>
    </div>
  );
}
