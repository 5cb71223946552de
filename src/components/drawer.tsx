import { useEffect, useRef } from 'react';
import type { ReactNode } from 'react';

interface DrawerProps {
  id?: string;
  open: boolean;
  onClose: () => void;
  label: string;
  children: ReactNode;
}

/**
 * A panel that slides over the screen from the left, modal while open: the browser's own dialog
 * keeps focus inside, closes on Escape and hands focus back to the button that opened it.
 * A click on the dimmed backdrop closes it too.
 */
export function Drawer({ id, open, onClose, label, children }: DrawerProps) {
  const dialog = useRef<HTMLDialogElement>(null);

  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (open && !element.open) element.showModal?.();
    if (!open && element.open) element.close?.();
  }, [open]);

  return (
    <dialog
      id={id}
      ref={dialog}
      aria-label={label}
      onClose={onClose}
      onClick={(event) => {
        if (event.target === dialog.current) onClose();
      }}
      className="m-0 h-dvh max-h-none w-72 max-w-[85vw] bg-ink-950 p-0 text-ink-100 backdrop:bg-ink-950/60 motion-safe:open:animate-[drawer-in_160ms_ease-out]"
    >
      {open && children}
    </dialog>
  );
}
