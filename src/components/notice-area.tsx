import { Toaster } from 'sonner';

/**
 * Where notices appear: one polite live region for the whole app (sonner), in our type and
 * colours. Failures are announced the same way and stay until closed.
 */
export function NoticeArea() {
  return (
    <Toaster
      position="bottom-right"
      closeButton
      containerAriaLabel="Notices"
      toastOptions={{
        classNames: {
          toast: 'font-sans text-body !rounded-card !border !border-paper-300 !bg-paper-50 !text-ink-900',
          success: '!border-moss-500',
          error: '!border-brick-500 !bg-brick-100 !text-brick-700',
          actionButton: '!bg-ink-900 !text-paper-50 !font-bold',
        },
      }}
    />
  );
}
