import { useId } from 'react';
import { FilePickButton } from './file-pick-button';
import { INSTRUMENT_FILES } from './instrument-files';

interface FileFieldProps {
  label: string;
  /** The file types offered; an instrument export unless said otherwise. */
  accept?: string;
  hint?: string;
  /** The name of the file already chosen, shown beside the button. */
  fileName?: string | null;
  disabled?: boolean;
  onFile: (file: File) => void;
}

/**
 * Halflight's file picker: a labelled button and the chosen file's name, instead of the browser's
 * bare control (the input itself: FilePickButton).
 */
export function FileField({
  label,
  accept = INSTRUMENT_FILES,
  hint,
  fileName,
  disabled = false,
  onFile,
}: FileFieldProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <span id={`${id}-label`} className="text-body font-bold text-ink-900">
        {label}
      </span>
      <div className="flex flex-wrap items-center gap-3 rounded-md border border-dashed border-ink-400 bg-white px-3 py-2.5">
        <FilePickButton
          accept={accept}
          text="Choose a file"
          disabled={disabled}
          labelledBy={`${id}-label`}
          describedBy={[hint && `${id}-hint`, `${id}-chosen`].filter(Boolean).join(' ')}
          onFile={onFile}
        />
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
