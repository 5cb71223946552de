import { csvTable } from '../../lib/csv-cells';
import type { LabContext } from '../../domain/lab-context';
import { getStudyDetail } from './study.service';

/** The series with raw and corrected values (SI units), the fit's ratio and residual per point. */
export async function exportPointsCsv(lab: LabContext, studyId: string) {
  const study = await getStudyDetail(lab, studyId);
  const used = new Map(study.latestFit?.pointsUsed.map((point) => [point.position, point]) ?? []);
  const residuals = new Map(
    study.latestFit?.pointsUsed.map((point, i) => [point.position, study.latestFit!.result.plot.points[i]?.residual]) ??
      [],
  );
  const header = [
    'position',
    'concentration_mol_per_L',
    study.dataKind === 'ratio' ? 'I0_over_I' : 'intensity',
    'lifetime_s',
    'absorbance_excitation',
    'absorbance_emission',
    'volume_added_L',
    'uncertainty',
    'excluded',
    'exclusion_reason',
    'corrected_concentration_mol_per_L',
    'corrected_intensity',
    'ratio_used',
    'residual',
  ];
  const rows = study.points.map((point) => [
    point.position + 1,
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
  const rows: unknown[][] = [['quantity', 'value', 'standard_error', 'interval95_lower', 'interval95_upper', 'unit']];
  const units: Record<string, string> = {
    kSv: 'M^-1',
    kq: 'M^-1 s^-1',
    kqFromLifetimes: 'M^-1 s^-1',
    kD: 'M^-1',
    kS: 'M^-1',
    intercept: '1',
    accessibleFraction: '1',
    sum: 'M^-1',
    product: 'M^-2',
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
      ['engine_version', fit.engineVersion, '', '', '', ''],
      ['fitted_at', fit.createdAt, '', '', '', ''],
    );
    for (const [name, estimate] of Object.entries(fit.result.parameters)) {
      rows.push([
        name,
        estimate.value,
        estimate.standardError,
        estimate.interval95.lower,
        estimate.interval95.upper,
        units[name] ?? '',
      ]);
    }
    const stats = fit.result.statistics;
    rows.push(['n', stats.n, '', '', '', ''], ['r_squared', stats.rSquared, '', '', '', '']);
    if (fit.result.tau0) rows.push(['tau0', fit.result.tau0.value, fit.result.tau0.standardError, '', '', 's']);
    if (fit.result.diffusionLimit)
      rows.push(
        ['k_diff', fit.result.diffusionLimit.value, '', '', '', 'M^-1 s^-1'],
        ['kq_over_k_diff', fit.result.diffusionLimit.ratio, '', '', '', '1'],
      );
    for (const flag of fit.result.flags) rows.push(['flag', flag.title, flag.detail ?? '', '', '', '']);
  } else rows.push(['fit', study.fitProblem ?? 'no fit yet', '', '', '', '']);
  return { fileName: `${slug(study.title)}-fit.csv`, body: csvTable(rows) };
}

const slug = (title: string) =>
  title
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60) || 'study';
