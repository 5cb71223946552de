import { isoDateTime, rSquaredLines, titled, UNITS, weightingText } from '@shared/format';
import type { Estimate, FitResult } from '@shared/schemas/study-fits';
import { csvTable } from '../../lib/csv-cells';
import type { LabContext } from '../../domain/lab-context';
import { getStudyDetail } from './study.service';

/** The series with raw and corrected values (SI units), the fit's ratio and residual per point. */
export async function exportPointsCsv(lab: LabContext, studyId: string) {
  const study = await getStudyDetail(lab, studyId);
  const used = new Map(study.latestFit?.pointsUsed.map((point) => [point.position, point]) ?? []);
  const residuals = new Map(study.latestFit?.result.plot.points.map((point) => [point.position, point.residual]) ?? []);
  const header = [
    'position',
    'run',
    titled('[Q]', UNITS.molar),
    study.dataKind === 'ratio' ? 'I0/I' : 'intensity',
    titled('lifetime', UNITS.second),
    'absorbance at excitation',
    'absorbance at emission',
    titled('volume added', 'L'),
    'uncertainty',
    'excluded',
    'reason left out',
    titled('corrected [Q]', UNITS.molar),
    'corrected intensity',
    'I0/I used',
    'residual',
  ];
  const rows = study.points.map((point) => [
    point.position + 1,
    point.series,
    point.concentration,
    point.intensity,
    point.lifetime,
    point.absorbanceExcitation,
    point.absorbanceEmission,
    point.volumeAdded,
    point.uncertainty,
    point.excluded ? 'yes' : 'no',
    point.exclusionReason,
    point.corrected?.concentration,
    point.corrected?.intensity,
    used.get(point.position)?.ratio,
    study.latestFit?.model.startsWith('linear') ? residuals.get(point.position) : '',
  ]);
  return { fileName: `${slug(study.title)}-points.csv`, body: csvTable([header, ...rows]) };
}

/** The newest fit: each parameter with SE and 95 % interval, statistics, flags, engine version. */
export async function exportFitCsv(lab: LabContext, studyId: string) {
  const study = await getStudyDetail(lab, studyId);
  const fit = study.latestFit;
  const rows: unknown[][] = [
    ['quantity', 'value', 'standard_error', 'interval95_lower', 'interval95_upper', 'unit', 'standard_error_includes'],
  ];
  const units: Record<string, string> = {
    kSv: UNITS.perMolar,
    kq: UNITS.perMolarPerSecond,
    kqFromLifetimes: UNITS.perMolarPerSecond,
    kD: UNITS.perMolar,
    kS: UNITS.perMolar,
    intercept: '1',
    accessibleFraction: '1',
    sum: UNITS.perMolar,
    product: UNITS.perMolarSquared,
  };
  rows.push(
    ['study', study.title, '', '', '', ''],
    ['emitter', study.emitter.name, '', '', '', ''],
    ['quencher', study.quencher.name, '', '', '', ''],
    ['solvent', study.solventLabel, '', '', '', ''],
  );
  if (fit) {
    rows.push(
      ['model', fit.model, '', '', '', ''],
      ['weighting', fit.result.weighting?.applied ?? '', '', '', '', '', weightingText(fit.result.weighting)],
      ['engine_version', fit.engineVersion, '', '', '', ''],
      ['fitted_at', isoDateTime(fit.createdAt), '', '', '', ''],
    );
    for (const [name, estimate] of Object.entries(fit.result.parameters))
      rows.push(estimateRow(name, estimate, units[name] ?? '', estimate.includes ?? ''));
    const stats = fit.result.statistics;
    rows.push(['n', stats.n, '', '', '', '']);
    for (const line of rSquaredLines(stats)) rows.push([line.key, line.value, '', '', '', '', line.label]);
    if (fit.result.tau0)
      rows.push([
        'tau0',
        fit.result.tau0.value,
        fit.result.tau0.standardError ?? '',
        '',
        '',
        UNITS.second,
        fit.result.tau0.source,
      ]);
    if (fit.result.diffusionLimit)
      rows.push(
        ['k_diff', fit.result.diffusionLimit.value, '', '', '', UNITS.perMolarPerSecond],
        ['kq_over_k_diff', fit.result.diffusionLimit.ratio, '', '', '', '1'],
      );
    for (const flag of fit.result.flags) rows.push(['flag', flag.title, flag.detail ?? '', '', '', '']);
    rows.push(...replicateRows(fit.result.replicates));
  } else rows.push(['fit', study.fitProblem ?? 'no fit yet', '', '', '', '']);
  return { fileName: `${slug(study.title)}-fit.csv`, body: csvTable(rows) };
}

/** One estimate as a row: name, value, SE, 95 % interval, unit and what the SE includes. */
const estimateRow = (name: string, estimate: Estimate, unit: string, includes: string): unknown[] => [
  name,
  estimate.value,
  estimate.standardError,
  estimate.interval95.lower,
  estimate.interval95.upper,
  unit,
  includes,
];

/**
 * Pooled runs in the fit CSV: each run's I0 (SE of its blank mean), the weighted and unweighted
 * K_SV of the pooled ratios, and one row per [Q] with the mean I0/I, its sample SD in the
 * standard_error column and the number of readings in the last.
 */
function replicateRows(replicates: FitResult['replicates']): unknown[][] {
  if (!replicates) return [];
  const rows: unknown[][] = replicates.runs.map((run) => [
    `run_${run.series}_i0`,
    run.value,
    run.standardError ?? '',
    '',
    '',
    '',
    `mean of ${run.blanks} blank(s)`,
  ]);
  const { weighting } = replicates;
  if (weighting)
    rows.push(
      estimateRow('kSv_weighted', weighting.weighted, UNITS.perMolar, `weights 1/σ² from the ${weighting.source}`),
      estimateRow('kSv_unweighted', weighting.unweighted, UNITS.perMolar, 'the same points unweighted'),
    );
  for (const row of replicates.summary)
    rows.push([
      `ratio_mean_at_${row.concentration}_M`,
      row.mean,
      row.sd ?? '',
      '',
      '',
      '1',
      `I0/I mean ± sample SD of ${row.n} reading(s) at [Q] = ${row.concentration} M`,
    ]);
  return rows;
}

const slug = (title: string) =>
  title
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60) || 'study';
