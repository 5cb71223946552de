import type { ReactNode } from 'react';
import { formatNumber } from '@shared/format';
import type { DecayPreview, DecayTimeUnit } from '@shared/schemas/decays';
import { Button } from '@/components/button';
import { FileField } from '@/components/file-field';
import { FormAlert } from '@/components/form-alert';
import { INSTRUMENT_FILE_NAMES } from '@/components/instrument-files';
import { SelectField } from '@/components/select-field';
import { describeError } from '@/lib/form-errors';
import { TIME_UNIT_OPTIONS } from './decay-file-choices';
import { DecayModelPicker } from './decay-model-picker';
import type { DecayReadChoices } from './decay-read-choices';

/**
 * The fields of a decay reading: decay file, optional response file, model, time unit and "Fit
 * again"; then "Reading and fitting…" or why the reading failed.
 */
export function DecayReadFields({
  choices,
  fileLabel,
  fileHint,
  reading,
}: {
  choices: DecayReadChoices;
  fileLabel: string;
  /** what the decay file holds; the file types read are added after it */
  fileHint: string;
  reading: { isPending: boolean; error: Error | null };
}) {
  const { file, response, model, timeUnit, setFile, setResponse, setModel, setTimeUnit, lookAt } = choices;
  return (
    <>
      <div className="grid gap-3 sm:grid-cols-2">
        <FileField
          label={fileLabel}
          hint={`${fileHint} (${INSTRUMENT_FILE_NAMES}).`}
          fileName={file?.name}
          onFile={(chosen) => {
            setFile(chosen);
            lookAt({ file: chosen });
          }}
        />
        <div className="space-y-1">
          <FileField
            label="Response file (optional)"
            hint="Only when the instrument response is not a column of the decay file."
            fileName={response?.name}
            onFile={(chosen) => {
              setResponse(chosen);
              lookAt({ response: chosen });
            }}
          />
          {response && (
            <Button
              variant="quiet"
              onClick={() => {
                setResponse(null);
                lookAt({ response: null });
              }}
            >
              Use no response file
            </Button>
          )}
        </div>
      </div>
      <DecayModelPicker model={model} onChange={setModel} />
      <div className="flex flex-wrap items-end gap-3">
        <SelectField
          label="Time unit, when the header names none"
          value={timeUnit ?? ''}
          options={TIME_UNIT_OPTIONS}
          onChange={(event) => setTimeUnit(event.target.value === '' ? null : (event.target.value as DecayTimeUnit))}
        />
        <Button variant="quiet" disabled={!file} pending={reading.isPending} onClick={() => lookAt()}>
          Fit again with these choices
        </Button>
      </div>
      {reading.isPending && <p className="text-body">Reading and fitting…</p>}
      {reading.error && <FormAlert>{describeError(reading.error)}</FormAlert>}
    </>
  );
}

interface DecayPreviewCardProps {
  preview: DecayPreview;
  /** said after what was read, e.g. the lifetime found */
  summary?: ReactNode;
  /** the keep mutation: its button waits while it runs and its error shows above the button */
  keeping: { isPending: boolean; error: Error | null };
  keepLabel: string;
  /** kept back for a reason of the caller's own (a preview with open questions is never kept) */
  keepDisabled?: boolean;
  onKeep: () => void;
  /** the caller's view of the preview and its own fields, between the summary and the keep button */
  children: ReactNode;
}

/**
 * A reading not kept yet: the file, its format, channels and where the response came from (then
 * `summary`), each question or warning, the caller's view of it, and the keep button.
 */
export function DecayPreviewCard({
  preview,
  summary,
  keeping,
  keepLabel,
  keepDisabled = false,
  onKeep,
  children,
}: DecayPreviewCardProps) {
  return (
    <div aria-label="Decay preview" className="space-y-3 rounded-md border border-paper-300 p-3">
      <p className="text-body">
        <strong>{preview.fileName}</strong>: {preview.format}, {preview.channels} channels
        {preview.channelWidth ? ` of ${formatNumber(preview.channelWidth * 1e12, 4)} ps` : ''}
        {preview.responseSource ? `, response from the ${preview.responseSource}` : ', no response'}.{summary}
      </p>
      {[...preview.questions, ...preview.warnings].map((text) => (
        <FormAlert key={text} tone="note">
          {text}
        </FormAlert>
      ))}
      {children}
      {keeping.error && <FormAlert>{describeError(keeping.error)}</FormAlert>}
      <Button pending={keeping.isPending} disabled={preview.questions.length > 0 || keepDisabled} onClick={onKeep}>
        {keepLabel}
      </Button>
    </div>
  );
}
