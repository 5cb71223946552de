import { formatEstimate, formatNumber } from '@shared/format';
import {
  MECHANISM_READING_WORDS,
  MECHANISM_VERDICT_WORDS,
  type MechanismEvidence,
  type MechanismPieceAnswer,
} from '@shared/schemas/mechanism-evidence';
import { ErrorNotice } from '@/components/error-notice';
import { NotesList } from '@/components/notes-list';
import { Signal } from '@/components/signal';
import { Tag } from '@/components/tag';
import { TextLink } from '@/components/text-link';
import { paths } from '@/lib/paths';
import { useMechanismEvidence } from '../api/get-mechanism-evidence';

type Kind = MechanismEvidence['missing'][number]['kind'];

/** Where each missing piece is added: an anchor on the study screen, given by the screen. */
export type EvidenceAnchors = Partial<Record<Kind, { href: string; label: string }>>;

const verdictTone: Record<MechanismEvidence['verdict'], string> = {
  dynamic: 'border-moss-500 bg-moss-100',
  static: 'border-brick-500 bg-brick-100',
  both: 'border-glow-400 bg-glow-50',
  'two-emitters': 'border-glow-400 bg-glow-50',
  unclear: 'border-paper-300 bg-paper-100',
};

function PieceNumbers({ numbers }: { numbers: MechanismPieceAnswer['numbers'] }) {
  if (numbers.length === 0) return null;
  return (
    <dl className="mt-2 grid gap-x-4 gap-y-1 text-caption sm:grid-cols-[auto_1fr]">
      {numbers.map((number) => (
        <div key={number.label} className="contents">
          <dt className="font-bold text-ink-600">{number.label}</dt>
          <dd className="break-words">
            {number.standardError === null
              ? `${formatNumber(number.value)}${number.unit ? ` ${number.unit}` : ''}`
              : formatEstimate(number.value, number.standardError, number.unit)}
          </dd>
        </div>
      ))}
    </dl>
  );
}

function MissingLink({
  labId,
  evidence,
  kind,
  anchors,
}: {
  labId: string;
  evidence: MechanismEvidence;
  kind: Kind;
  anchors: EvidenceAnchors;
}) {
  if (kind === 'temperature')
    return (
      <TextLink to={paths.temperatureSeries(labId, evidence.series?.studyIds)}>
        {evidence.series ? 'Open its temperature series' : 'Temperature series'}
      </TextLink>
    );
  const anchor = anchors[kind];
  if (!anchor) return null;
  return (
    <a
      className="font-bold text-ink-800 underline decoration-glow-400 underline-offset-4 hover:text-ink-950"
      href={anchor.href}
    >
      {anchor.label}
    </a>
  );
}

/**
 * The study's mechanism evidence: the combined verdict with its reasons, each piece that exists with
 * what it says and its numbers, and each missing piece with where to add it.
 */
export function MechanismPanel({
  labId,
  studyId,
  fitId,
  anchors,
}: {
  labId: string;
  studyId: string;
  fitId: string | null;
  anchors: EvidenceAnchors;
}) {
  const query = useMechanismEvidence(labId, studyId, fitId);
  if (query.isError) return <ErrorNotice error={query.error} what="the mechanism evidence" />;
  if (!query.data) return <Signal tone="waiting">Reading the evidence</Signal>;
  const evidence = query.data;
  return (
    <div className="space-y-4">
      <div
        aria-label="Combined verdict"
        role="group"
        className={`rounded-md border-l-4 p-4 ${verdictTone[evidence.verdict]}`}
      >
        <p className="text-caption font-bold tracking-wide text-ink-600">Combined verdict</p>
        <p className="text-lead font-bold text-ink-950">{MECHANISM_VERDICT_WORDS[evidence.verdict]}</p>
        <NotesList items={evidence.reasons} size="body" className="mt-2" />
      </div>
      {evidence.pieces.length > 0 && (
        <ul aria-label="Evidence" className="grid gap-3 md:grid-cols-2">
          {evidence.pieces.map((piece) => (
            <li key={piece.kind} className="rounded-md border border-paper-300 p-3">
              <article aria-label={piece.title}>
                <header className="flex flex-wrap items-baseline justify-between gap-2">
                  <h3 className="text-body font-bold text-ink-900">{piece.title}</h3>
                  <Tag tone="neutral">{MECHANISM_READING_WORDS[piece.reading]}</Tag>
                </header>
                <p className="mt-1 text-body text-ink-800">{piece.summary}</p>
                <PieceNumbers numbers={piece.numbers} />
              </article>
            </li>
          ))}
        </ul>
      )}
      {evidence.missing.length > 0 && (
        <div>
          <h3 className="text-body font-bold text-ink-900">Not yet measured</h3>
          <ul aria-label="Missing evidence" className="mt-1 space-y-2 text-body">
            {evidence.missing.map((piece) => (
              <li key={piece.kind}>
                <strong>{piece.title}.</strong> {piece.reason}{' '}
                <MissingLink labId={labId} evidence={evidence} kind={piece.kind} anchors={anchors} />
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
