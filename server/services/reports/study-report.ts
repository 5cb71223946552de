import {
  fitParameterLines,
  formatEstimate,
  formatInterval,
  formatNumber,
  isoDateTime,
  rSquaredLines,
  replicateRunsText,
  tau0Text,
  UNITS,
  weightingComparisonText,
  weightingText,
} from '@shared/format';
import type { StudyDetail } from '@shared/schemas/study-detail';
import type { FitResult } from '@shared/schemas/study-fits';
import { fitModelNames } from '@shared/schemas/studies';
import { toMillimolar, toNanoseconds } from '@shared/units/units';
import type { LabContext } from '../../domain/lab-context';
import { drivingForceOfStudy } from '../library/driving-force.service';
import { getStudyDetail } from '../studies/study.service';
import { createReport, facts, finish, fixed, heading, sci, table } from './pdf-document';
import type { Pdf } from './pdf-document';
import { drawLifetime, drawSternVolmer } from './plot-drawing';
import { decaysSection } from './decay-report';
import { mechanismSection } from './mechanism-report';
import type { UploadServices } from '../studies/study-upload.service';

const date = isoDateTime;

function conditions(doc: Pdf, study: StudyDetail) {
  heading(doc, 'Conditions');
  facts(doc, [
    ['Emitter', study.emitter.name],
    ['Quencher', study.quencher.name],
    ['Solvent', study.solventLabel],
    ['Temperature', `${fixed(study.temperature, 5)} K`],
    [
      'Excitation / emission',
      `${study.excitationWavelength ?? '—'} nm / ${study.emissionWavelength ?? (study.windowStart ? `${study.windowStart}–${study.windowEnd} nm window` : '—')}${study.emissionWavelength ? ' nm' : ''}`,
    ],
    ['Atmosphere, degassing', `${study.atmosphere}, ${study.degassingMethod}`],
    [
      'τ0',
      study.tau0
        ? `${formatEstimate(toNanoseconds(study.tau0), study.tau0Uncertainty === null ? null : toNanoseconds(study.tau0Uncertainty), UNITS.nanosecond)}${study.tau0LifetimeId ? ' (from a lifetime record)' : study.tau0Source ? ` (from decay ${study.tau0Source.fileName})` : ''}`
        : 'not given',
    ],
    [
      'Corrections',
      [study.dilutionCorrection && 'dilution', study.innerFilterCorrection && 'inner filter']
        .filter(Boolean)
        .join(', ') || 'none',
    ],
  ]);
}

function results(doc: Pdf, study: StudyDetail) {
  heading(doc, 'Fit');
  const fit = study.latestFit;
  if (!fit) {
    doc.text(study.fitProblem ? `No fit: ${study.fitProblem}` : 'No fit yet.');
    return;
  }
  const { lines, note } = fitParameterLines(fit.model, fit.result);
  facts(doc, [
    ['Model', fitModelNames[fit.model]],
    ...(fit.result.intensity === 'no-intensity-data'
      ? [
          ['Intensity fit', 'no intensity data: K_SV and kq come from the lifetime Stern–Volmer fit (τ0/τ)'] as [
            string,
            string,
          ],
        ]
      : []),
    ['Weighting', weightingText(fit.result.weighting)],
    ...lines.map(
      ({ label, unit, estimate }) =>
        [
          label,
          `${formatEstimate(estimate.value, estimate.standardError, unit)} (95 % interval ${formatInterval(estimate.interval95.lower, estimate.interval95.upper, estimate.standardError, estimate.value)})${estimate.includes ? `; SE includes ${estimate.includes}` : ''}`,
        ] as [string, string],
    ),
    ...(note
      ? [[fit.result.intensity === 'no-intensity-data' ? 'Lifetimes only' : 'Roots', note] as [string, string]]
      : []),
    ...rSquaredLines(fit.result.statistics).map((line) => [line.label, line.value.toFixed(4)] as [string, string]),
    ['n', `${fit.result.statistics.n} points`],
    ...(fit.result.tau0 ? [['τ0 used', tau0Text(fit.result.tau0)] as [string, string]] : []),
    [
      'Diffusion limit',
      fit.result.diffusionLimit
        ? `${sci(fit.result.diffusionLimit.value)} ${UNITS.perMolarPerSecond} (${fit.result.diffusionLimit.basis}); kq/k_diff = ${fixed(fit.result.diffusionLimit.ratio, 3)}`
        : '—',
    ],
    ['Curvature', fit.result.statistics.curvature ?? '—'],
    ['Fitted', `${date(fit.createdAt)} by ${fit.createdBy ?? 'Halflight'}, engine ${fit.engineVersion}`],
  ]);
  drawSternVolmer(doc, fit.result);
  if (fit.result.replicates) replicates(doc, fit.result.replicates);
  if (fit.result.lifetime) {
    heading(doc, 'Lifetimes');
    const { kSv, rSquared, verdict } = fit.result.lifetime;
    doc.text(
      `K_SV from lifetimes: ${formatEstimate(kSv.value, kSv.standardError, UNITS.perMolar)}, R² ${fixed(rSquared, 5)}${verdict ? `. ${verdict}` : ''}`,
    );
    drawLifetime(doc, fit.result.lifetime);
  }
  heading(doc, 'Flags');
  if (fit.result.flags.length === 0) doc.text('None.');
  for (const flag of fit.result.flags) {
    doc
      .font('Lato-Bold')
      .text(`${flag.title}${flag.detail ? ` (${flag.detail})` : ''}`)
      .font('Lato')
      .text(flag.explanation);
    if (flag.whatToDo) doc.text(`What to do: ${flag.whatToDo}`);
    doc.text(`Check: ${flag.whatToCheck.join('; ')}.`).moveDown(0.3);
  }
}

/** Pooled runs: each run's I0, mean ± SD of I0/I per [Q], and the weighted fit beside the unweighted one. */
function replicates(doc: Pdf, pooled: NonNullable<FitResult['replicates']>) {
  heading(doc, 'Replicate runs');
  doc.text(`${replicateRunsText(pooled)}.`);
  if (pooled.weighting) doc.text(weightingComparisonText(pooled.weighting));
  doc.moveDown(0.3);
  table(
    doc,
    [`[Q] (${UNITS.millimolar})`, 'Readings', 'I0/I mean ± SD'],
    pooled.summary.map((row) => [
      fixed(toMillimolar(row.concentration), 5),
      String(row.n),
      row.sd === null ? formatNumber(row.mean, 4) : formatEstimate(row.mean, row.sd, ''),
    ]),
    [80, 60, 140],
  );
}

function points(doc: Pdf, study: StudyDetail) {
  heading(doc, 'Points');
  table(
    doc,
    [
      '#',
      'Run',
      `[Q] (${UNITS.millimolar})`,
      study.dataKind === 'ratio' ? 'I0/I' : 'Intensity',
      `τ (${UNITS.nanosecond})`,
      'A ex',
      'A em',
      'Used',
      'Reason left out',
    ],
    study.points.map((point) => [
      String(point.position + 1),
      String(point.series),
      fixed(toMillimolar(point.concentration), 5),
      fixed(point.intensity, 5),
      point.lifetime ? fixed(toNanoseconds(point.lifetime), 4) : '—',
      fixed(point.absorbanceExcitation),
      fixed(point.absorbanceEmission),
      point.excluded ? 'no' : 'yes',
      point.exclusionReason ?? '',
    ]),
    [25, 25, 60, 70, 55, 45, 45, 35, 135],
  );
}

async function drivingForceSection(doc: Pdf, lab: LabContext, study: StudyDetail) {
  heading(doc, 'Driving force (Rehm–Weller estimate)');
  const result = await drivingForceOfStudy(lab, {
    ...study,
    emitterId: study.emitter.id,
    quencherId: study.quencher.id,
  });
  if (!result) {
    doc.text('Not computed: the study uses a custom solvent without a permittivity in the solvent table.');
    return;
  }
  const line = (name: 'oxidative' | 'reductive') => {
    const value = result[name];
    return value
      ? `${fixed(value.electronvolts, 3)} eV (${fixed(value.kilojoulesPerMole, 4)} kJ/mol); Coulomb term ${fixed(value.workTerm, 2)} eV`
      : 'missing inputs';
  };
  facts(doc, [
    ['Potentials against', result.reference],
    ['Oxidative quenching', line('oxidative')],
    ['Reductive quenching', line('reductive')],
    [
      'Highlighted',
      result.highlighted ? `${result.highlighted}${result.pinned ? ' (pinned)' : ' (more favourable)'}` : '—',
    ],
    [
      'Energy transfer',
      result.energyTransfer ? (result.energyTransfer.possible ? 'possible' : 'uphill') : 'triplet energies missing',
    ],
  ]);
  result.missing.forEach((item) => doc.fontSize(8.5).text(`Missing: ${item.message}.`));
  doc.fontSize(10);
}

function review(doc: Pdf, study: StudyDetail) {
  heading(doc, 'Review');
  const approval = [...study.reviews].reverse().find((entry) => entry.action === 'approve');
  facts(doc, [
    ['Status', `${study.status}, revision ${study.revision}`],
    ['Approved', approval ? `by ${approval.author ?? 'unknown'} on ${date(approval.createdAt)}` : 'not approved'],
  ]);
  study.reviews.forEach((entry) =>
    doc
      .fontSize(8.5)
      .text(
        `${date(entry.createdAt)} · ${entry.author ?? '—'} · ${entry.action}${entry.comment ? `: ${entry.comment}` : ''}`,
      ),
  );
  doc.fontSize(10);
  heading(doc, 'Raw files');
  if (study.uploads.length === 0) doc.text('No files uploaded; points were entered by hand.');
  study.uploads.forEach((upload) =>
    doc
      .fontSize(8.5)
      .text(
        `${upload.fileName} (${upload.size} bytes, ${upload.parseStatus}) SHA-256 ${upload.sha256}${upload.reading ? `; read as ${upload.reading}` : ''}`,
      ),
  );
  doc.fontSize(10);
}

/**
 * The PDF report of one study: identification, conditions, points, plots, fit, flags, decays
 * (their fits and plots, drawn from the kept files), mechanism evidence, driving force, review, files.
 */
export async function studyReport(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
): Promise<{ pdf: Buffer; filename: string }> {
  const study = await getStudyDetail(lab, studyId);
  const doc = createReport(
    study.title,
    `${lab.name} · owner ${study.ownerName} · created ${date(study.createdAt)} · last changed ${date(study.updatedAt)}`,
  );
  conditions(doc, study);
  results(doc, study);
  points(doc, study);
  await decaysSection(doc, services, lab, study.id);
  await mechanismSection(doc, lab, study.id);
  await drivingForceSection(doc, lab, study);
  review(doc, study);
  if (study.notes) {
    heading(doc, 'Notes');
    doc.text(study.notes);
  }
  return {
    pdf: await finish(doc),
    filename: `study-${study.title.replace(/[^\w.-]+/g, '_').slice(0, 60)}-r${study.revision}.pdf`,
  };
}
