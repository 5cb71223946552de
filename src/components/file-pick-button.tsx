import { useId, type Ref } from 'react';

interface FilePickButtonProps {
  accept: string;
  /** what the button says ("Choose a file") */
  text: string;
  disabled?: boolean;
  /** the input's accessible name: the id of a visible label, or the label's text */
  labelledBy?: string;
  label?: string;
  describedBy?: string;
  /** the file input itself, for a panel that gives it focus (after "Set aside", say) */
  inputRef?: Ref<HTMLInputElement>;
  onFile: (file: File) => void;
}

/**
 * The file input every Halflight picker uses: the real input stays in the page (visually hidden)
 * so keyboards, screen readers and the browser's file dialog work as usual, and a styled button
 * beside it shows the input's focus ring. Picking the same file again reads it again.
 */
export function FilePickButton({
  accept,
  text,
  disabled = false,
  labelledBy,
  label,
  describedBy,
  inputRef,
  onFile,
}: FilePickButtonProps) {
  const id = useId();
  return (
    <>
      <input
        ref={inputRef}
        id={id}
        type="file"
        accept={accept}
        disabled={disabled}
        aria-labelledby={labelledBy}
        aria-label={label}
        aria-describedby={describedBy}
        className="peer sr-only"
        onChange={(event) => {
          const file = event.target.files?.[0];
          if (file) onFile(file);
          event.target.value = '';
        }}
      />
      <label
        htmlFor={id}
        className="cursor-pointer rounded-md border border-ink-400 bg-paper-50 px-4 py-1.5 text-body font-bold text-ink-800 peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-solid peer-disabled:cursor-not-allowed peer-disabled:opacity-60 hover:border-ink-600"
      >
        {text}
      </label>
    </>
  );
}
