import { formatEstimate, UNITS } from '@shared/format';
import { fromSi, toMillimolar, toNanoseconds } from '@shared/units/units';
import type { DecayModel, DecaySet } from '@shared/schemas/decays';
import type { LabContext } from '../../domain/lab-context';
import { decaySetCurves, listStudyDecaySets } from '../decays/decay-sets.service';
import type { UploadServices } from '../studies/study-upload.service';
import { drawDecay } from './decay-drawing';
import { facts, fixed, heading, table, type Pdf } from './pdf-document';
import { drawLifetime } from './plot-drawing';

/** A report draws at most this many decays of one set; the others are on screen (each plot takes a third of a page). */
export const REPORT_DECAYS_PER_SET = 8;

const modelText = (model: DecayModel) =>
  `${model.components} exponential${model.components === 1 ? '' : 's'}, ${
    model.method === 'tail'
      ? `tail fit from channel ${model.startChannel ?? 'chosen automatically'}`
      : 'reconvolution with the response'
  }, ${model.estimator === 'poisson' ? 'Poisson maximum likelihood' : 'least squares weighted by 1/max(counts, 1)'}`;

const ns = toNanoseconds;

function setFacts(doc: Pdf, set: DecaySet) {
  facts(doc, [
    ['File', `${set.file.fileName} (${set.file.size} bytes) SHA-256 ${set.file.sha256}`],
    [
      'Response',
      set.responseFile
        ? `${set.responseFile.fileName} SHA-256 ${set.responseFile.sha256}`
        : set.responseSource === 'column'
          ? 'a column of the file'
          : 'none',
    ],
    [
      'Channels',
      `${set.channels} of ${set.channelWidth ? `${fixed(ns(set.channelWidth), 4)} ${UNITS.nanosecond}` : '—'}`,
    ],
    ['Model', modelText(set.model)],
    [
      'τ0 from the blank',
      set.sternVolmer
        ? formatEstimate(ns(set.sternVolmer.tau0.value), ns(set.sternVolmer.tau0.standardError), UNITS.nanosecond)
        : '—',
    ],
    [
      'Lifetime K_SV',
      set.sternVolmer
        ? formatEstimate(set.sternVolmer.kSv.value, set.sternVolmer.kSv.standardError, UNITS.perMolar)
        : (set.sternVolmerProblem ?? '—'),
    ],
    ['Fitted', `by ${set.createdBy ?? 'Halflight'}, engine ${set.engineVersion}`],
  ]);
}

function outcomeTable(doc: Pdf, set: DecaySet) {
  table(
    doc,
    ['Decay', `[Q] (${UNITS.millimolar})`, `τ (${UNITS.nanosecond})`, 'χ²/ν', 'Flags or problem'],
    set.outcomes.map((outcome) => [
      outcome.label,
      outcome.concentration === null ? '—' : fixed(toMillimolar(outcome.concentration), 4),
      outcome.lifetime
        ? `${formatEstimate(ns(outcome.lifetime.value), ns(outcome.lifetime.standardError), '')}${
            outcome.lifetime.basis === 'amplitude-weighted-mean' ? ' (mean)' : ''
          }`
        : '—',
      outcome.fit ? outcome.fit.reducedChiSquared.toFixed(2) : '—',
      outcome.problem ?? (outcome.fit?.flags.map((flag) => flag.title).join('; ') || 'none'),
    ]),
    [90, 55, 95, 40, 215],
  );
}

/**
 * The study's kept decay sets: for each, its file, model, tau0 and lifetime K_SV, a row per
 * decay, each fitted decay drawn again from the kept file and its stored parameters (up to
 * REPORT_DECAYS_PER_SET), and the set's lifetime Stern–Volmer plot. Nothing when the study has none.
 */
export async function decaysSection(doc: Pdf, services: UploadServices, lab: LabContext, studyId: string) {
  const sets = await listStudyDecaySets(lab, studyId);
  for (const set of sets) {
    heading(doc, `Decays: ${set.title}`);
    setFacts(doc, set);
    outcomeTable(doc, set);
    const fitted = set.outcomes.filter((outcome) => outcome.fit !== null);
    for (const outcome of fitted.slice(0, REPORT_DECAYS_PER_SET)) {
      drawDecay(doc, `Decay ${outcome.label}`, await decaySetCurves(services, lab, set.id, outcome.index));
    }
    if (fitted.length > REPORT_DECAYS_PER_SET)
      doc.text(`${fitted.length - REPORT_DECAYS_PER_SET} more decays of this set are drawn on the study's screen.`);
    if (set.sternVolmer) {
      doc.font('Lato-Bold').text('Lifetime Stern–Volmer plot of the set').font('Lato');
      drawLifetime(doc, {
        xAxis: { label: `[Q] (${UNITS.millimolar})`, scale: fromSi(1, 'mM') },
        points: set.sternVolmer.points.map((point) => ({ x: point.concentration, y: point.ratio })),
        kSv: set.sternVolmer.kSv,
      });
    }
  }
}
