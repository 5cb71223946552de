import {
  formatEstimate,
  formatFixed,
  formatNumber,
  isoDateTime,
  SYMBOLS,
  symbolText,
  titled,
  UNITS,
} from '@shared/format';
import { MECHANISM_VERDICT_WORDS } from '@shared/schemas/mechanism-evidence';
import { toMillimolar, toNanoseconds } from '@shared/units/units';
import type { LabContext } from '../../domain/lab-context';
import { compare } from '../comparisons/comparison.service';
import { getScenario } from '../scenarios/scenario.service';
import { createReport, facts, finish, heading, table } from './pdf-document';
import { drawComparisonChart, drawShareChart } from './report-charts';

const safeName = (text: string) => text.replace(/[^\w.-]+/g, '_').slice(0, 60);

/** A lab summary of one reaction scenario: components, kq sources and the shares intercepted. */
export async function scenarioReport(lab: LabContext, scenarioId: string) {
  const scenario = await getScenario(lab, scenarioId);
  const doc = createReport(
    `Who quenches: ${scenario.name}`,
    `${lab.name} · reaction scenario · last changed ${isoDateTime(scenario.updatedAt)}`,
  );
  facts(doc, [
    ['Emitter', scenario.emitter.name],
    ['Solvent', scenario.solvent],
    [
      'τ0',
      `${formatNumber(toNanoseconds(scenario.tau0), 4)} ${UNITS.nanosecond}${scenario.tau0Source ? ` (${scenario.tau0Source})` : ''}`,
    ],
  ]);
  heading(doc, 'Share of excited emitter intercepted');
  drawShareChart(doc, scenario);
  table(
    doc,
    ['Component', titled('In reaction', UNITS.millimolar), titled('kq', UNITS.perMolarPerSecond), 'kq from', 'Share'],
    [
      ...scenario.shares.map((share) => [
        share.label,
        formatNumber(toMillimolar(share.concentration), 4),
        share.kq === null ? 'none' : formatEstimate(share.kq, share.kqStandardError),
        share.kqSource?.kind === 'study'
          ? `${share.kqSource.title} (${share.kqSource.status}${share.kqSource.solvent !== scenario.solvent ? `, in ${share.kqSource.solvent}` : ''})`
          : share.kqSource?.kind === 'manual'
            ? `by hand: ${share.kqSource.note || 'no source given'}`
            : 'no study yet',
        share.fraction === null ? '—' : `${(share.fraction * 100).toFixed(1)} %`,
      ]),
      ['decays unquenched', '', '', '', `${(scenario.unquenched * 100).toFixed(1)} %`],
    ],
    [120, 70, 95, 150, 60],
  );
  scenario.missing.forEach((item) => doc.text(`No kq yet for ${item.label}: it is left out of the shares.`));
  doc.moveDown(0.5).font('Lato-Bold').text(scenario.caution);
  return { pdf: await finish(doc), filename: `scenario-${safeName(scenario.name)}.pdf` };
}

/** A lab summary of a comparison: the table (with each study's mechanism verdict) and the Rehm–Weller trend per solvent. */
export async function comparisonReport(
  lab: LabContext,
  side: 'emitter' | 'quencher',
  compoundId: string,
  approvedOnly: boolean,
) {
  const comparison = await compare(lab, side, compoundId, { approvedOnly, sort: 'kq' });
  const doc = createReport(
    `Comparison: ${comparison.compound.name}`,
    `${lab.name} · every ${side === 'emitter' ? 'quencher studied against this emitter' : 'emitter studied with this quencher'}`,
  );
  table(
    doc,
    [
      side === 'emitter' ? 'Quencher' : 'Emitter',
      titled('kq', UNITS.perMolarPerSecond),
      titled('K_SV', UNITS.perMolar),
      'Solvent',
      titled(symbolText(SYMBOLS.drivingForce), UNITS.electronvolt),
      'Status',
      'Flags',
      'Mechanism',
    ],
    comparison.rows.map((row) => [
      row.partner.name,
      row.kq ? formatEstimate(row.kq.value, row.kq.standardError) : '—',
      row.kSv ? formatEstimate(row.kSv.value, row.kSv.standardError) : '—',
      `${row.solvent}, ${row.temperature} K`,
      row.drivingForce
        ? `${formatFixed(row.drivingForce.electronvolts, 2, { signed: true })} (${row.drivingForce.pathway})`
        : 'missing',
      row.status,
      row.flags.map((flag) => flag.title).join('; '),
      MECHANISM_VERDICT_WORDS[row.mechanism],
    ]),
    [70, 80, 55, 55, 60, 45, 65, 65],
  );
  heading(doc, 'kq against driving force, per solvent');
  drawComparisonChart(doc, comparison);
  for (const trend of comparison.trends) {
    doc.text(
      trend.fit
        ? `${trend.label}: reorganisation energy λ = ${formatEstimate(trend.fit.reorganisationEnergy, trend.fit.reorganisationEnergyStandardError, UNITS.electronvolt)} from ${trend.fit.n} studies (k_d ${formatNumber(trend.diffusionLimit)} ${UNITS.perMolarPerSecond}).`
        : `${trend.label}: no fit (${trend.note}).`,
    );
  }
  doc
    .moveDown(0.5)
    .fontSize(8.5)
    .text(
      approvedOnly
        ? 'Trend fitted to approved results only.'
        : 'Trend fitted to approved and unapproved results; the status column tells them apart.',
    );
  return { pdf: await finish(doc), filename: `comparison-${safeName(comparison.compound.name)}.pdf` };
}
