import { useEffect, useRef, useState } from 'react';
import type { FileReading } from '@shared/schemas/file-reading';
import type { UploadMapping, UploadQuestionCode } from '@shared/schemas/study-uploads';
import { formatNumber } from '@shared/format';
import { concentrationDisplayUnit, fromSi, unitLabel, type ConcentrationUnit } from '@shared/units/units';
import { FormAlert } from '@/components/form-alert';
import { notify } from '@/lib/notify';
import { MappingEditor } from './mapping-editor';

type Reading = Omit<FileReading, 'fileName' | 'size'>;

/** The unit the file itself uses for [Q]: the mapping's for a series, else the one that reads best. */
function fileUnit(reading: Reading, mapping: UploadMapping): ConcentrationUnit {
  if (mapping.layout === 'series') return mapping.concentrationUnit as ConcentrationUnit;
  return concentrationDisplayUnit(Math.max(0, ...reading.points.map((point) => point.concentration)));
}

/** Doubts about the points (a unit slip?): each needs a tick before the points can be used. */
function Questions({
  questions,
  acknowledged,
  onAcknowledged,
}: {
  questions: Reading['questions'];
  acknowledged: readonly UploadQuestionCode[];
  onAcknowledged: (next: UploadQuestionCode[]) => void;
}) {
  return (
    <fieldset className="space-y-2 rounded-md border border-glow-300 bg-glow-50 px-3 py-2 text-body text-ink-800">
      <legend className="px-1 font-bold">Check before using these points</legend>
      {questions.map((question) => (
        <label key={question.code} className="flex items-start gap-2">
          <input
            type="checkbox"
            className="mt-1"
            checked={acknowledged.includes(question.code)}
            onChange={(event) =>
              onAcknowledged(
                event.target.checked
                  ? [...acknowledged, question.code]
                  : acknowledged.filter((code) => code !== question.code),
              )
            }
          />
          <span>
            {question.message} <strong>I have checked: the values are right as read.</strong>
          </span>
        </label>
      ))}
    </fieldset>
  );
}

/** What a file gave: the first rows, the mapping to confirm or change, the points in the file's own units. */
export function FilePreview({
  fileName,
  reading,
  mapping,
  onMapping,
  acknowledged,
  onAcknowledged,
}: {
  fileName: string;
  reading: Reading;
  mapping: UploadMapping;
  onMapping: (next: UploadMapping) => void;
  /** the questions of this reading the person has ticked */
  acknowledged: readonly UploadQuestionCode[];
  onAcknowledged: (next: UploadQuestionCode[]) => void;
}) {
  const unit = fileUnit(reading, mapping);
  // A file that names no concentration unit opens the columns and units: the choice is needed first.
  const runs = new Set(reading.points.map((point) => point.series)).size;
  const [mappingOpen, setMappingOpen] = useState(mapping.layout === 'series' && mapping.concentrationUnit === null);
  // The next step of an upload: focus goes to what the file gave, and the notice area says it
  // (once per file; a changed mapping re-reads the same file and leaves the focus where it is).
  const heading = useRef<HTMLHeadingElement>(null);
  const summary = `${fileName} read: ${reading.pointCount} points, ${reading.problems.length} problems`;
  const announced = useRef(summary);
  useEffect(() => {
    heading.current?.focus();
    notify.note(announced.current);
  }, [fileName]);
  return (
    <div className="space-y-3 rounded-md border border-paper-300 p-3">
      <h3 ref={heading} tabIndex={-1} className="text-body font-normal">
        <strong>{fileName}</strong>: {reading.format}, {reading.rowCount} rows.
      </h3>
      {/* contain:inline-size: a many-column spectrum matrix scrolls here instead of widening the page */}
      <div className="max-h-48 overflow-auto [contain:inline-size]">
        <table aria-label="Parsed table" className="text-caption">
          <thead>
            <tr>
              {reading.headers.map((header, i) => (
                <th key={i} className="px-2 text-left">
                  {header}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {reading.rows.slice(0, 12).map((row, i) => (
              <tr key={i}>
                {row.map((cell, j) => (
                  <td key={j} className="px-2">
                    {cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <details open={mappingOpen} onToggle={(event) => setMappingOpen(event.currentTarget.open)}>
        <summary className="cursor-pointer text-body font-bold text-ink-800">Columns and units</summary>
        <div className="mt-2">
          <MappingEditor headers={reading.headers} mapping={mapping} onChange={onMapping} />
        </div>
      </details>
      {reading.warnings.length > 0 && (
        <FormAlert tone="note">
          {reading.warnings.map((warning) => (
            <p key={warning}>{warning}</p>
          ))}
        </FormAlert>
      )}
      {reading.questions.length > 0 && (
        <Questions questions={reading.questions} acknowledged={acknowledged} onAcknowledged={onAcknowledged} />
      )}
      {reading.problems.length > 0 && (
        <FormAlert>
          {reading.problems.map((problem) => (
            <p key={problem.message}>{problem.message}</p>
          ))}
        </FormAlert>
      )}
      {reading.points.length > 0 && (
        <p aria-label="Points from the file" className="text-body">
          {reading.pointCount} points
          {runs > 1 ? ` in ${runs} runs` : ''}, [Q] in {unitLabel(unit)}:{' '}
          {reading.points
            .slice(0, 8)
            .map(
              (point) =>
                `${runs > 1 ? `run ${point.series}: ` : ''}${formatNumber(fromSi(point.concentration, unit), 4)} → ${formatNumber(point.intensity, 4)}`,
            )
            .join(' · ')}
          {reading.pointCount > 8 ? ' …' : ''}
        </p>
      )}
    </div>
  );
}
