import { useId } from 'react';

interface FileFieldProps {
  label: string;
  accept: string;
  hint?: string;
  /** The name of the file already chosen, shown beside the button. */
  fileName?: string | null;
  disabled?: boolean;
  onFile: (file: File) => void;
}

/**
 * Halflight's file picker: a labelled button and the chosen file's name, instead of the browser's
 * bare control. The real input stays in the page (visually hidden) so keyboards, screen readers and
 * the browser's file dialog work as usual; the button shows its focus ring.
 */
export function FileField({ label, accept, hint, fileName, disabled = false, onFile }: FileFieldProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <span id={`${id}-label`} className="text-body font-bold text-ink-900">
        {label}
      </span>
      <div className="flex flex-wrap items-center gap-3 rounded-md border border-dashed border-ink-400 bg-white px-3 py-2.5">
        <input
          id={id}
          type="file"
          accept={accept}
          disabled={disabled}
          aria-labelledby={`${id}-label`}
          aria-describedby={[hint && `${id}-hint`, `${id}-chosen`].filter(Boolean).join(' ')}
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
          Choose a file
        </label>
        <span id={`${id}-chosen`} className="text-body break-all text-ink-700">
          {fileName ? fileName : 'No file chosen yet'}
        </span>
      </div>
      {hint && (
        <p id={`${id}-hint`} className="text-caption text-ink-600">
          {hint}
        </p>
      )}
    </div>
  );
}
