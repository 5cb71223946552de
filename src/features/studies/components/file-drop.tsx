import { useState, type Ref } from 'react';
import { FilePickButton } from '@/components/file-pick-button';
import { INSTRUMENT_FILES } from '@/components/instrument-files';

interface Props {
  label: string;
  /** the chosen file's name, shown in place of the browser's "No file chosen" */
  fileName: string | null;
  /** 0..1 while the file is being sent, else null */
  progress: number | null;
  disabled?: boolean;
  /** the file input, for the panel to give focus back to */
  inputRef?: Ref<HTMLInputElement>;
  onFile: (file: File) => void;
}

/** Drop an instrument export here or pick one; shows the chosen name and how much has been sent. */
export function FileDrop({ label, fileName, progress, disabled = false, inputRef, onFile }: Props) {
  const [over, setOver] = useState(false);
  return (
    <div
      onDragOver={(event) => {
        event.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(event) => {
        event.preventDefault();
        setOver(false);
        const file = event.dataTransfer.files[0];
        if (file && !disabled) onFile(file);
      }}
      className={`rounded-card border-2 border-dashed p-4 text-body ${over ? 'border-glow-500 bg-glow-50' : 'border-paper-300 bg-white'}`}
    >
      <p className="font-bold text-ink-900">{label}</p>
      <p className="text-caption text-ink-600">
        Drop the file here, or pick it: .csv, .tsv, .txt, .dat, .asc, .xlsx or JCAMP-DX, up to 20 MB. Nothing is kept
        until you confirm.
      </p>
      <div className="mt-2 flex flex-wrap items-center gap-3">
        <FilePickButton
          text="Pick a file"
          label={label}
          accept={INSTRUMENT_FILES}
          disabled={disabled}
          inputRef={inputRef}
          onFile={onFile}
        />
        <span className="text-ink-800" aria-live="polite">
          {fileName ? (
            <>
              Chosen: <strong>{fileName}</strong>
            </>
          ) : (
            'No file yet'
          )}
        </span>
      </div>
      {progress !== null && (
        <progress className="mt-2 w-full" max={1} value={progress} aria-label={`Sending ${fileName ?? 'the file'}`}>
          {Math.round(progress * 100)} %
        </progress>
      )}
    </div>
  );
}
