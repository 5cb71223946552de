import type { LabContext } from '../../domain/lab-context';
import { compare } from '../comparisons/comparison.service';
import { getScenario } from '../scenarios/scenario.service';
import { createReport, facts, finish, fixed, heading, sci, table } from './pdf-document';

const safeName = (text: string) => text.replace(/[^\w.-]+/g, '_').slice(0, 60);

/** A lab summary of one reaction scenario: components, kq sources and the shares intercepted. */
export async function scenarioReport(lab: LabContext, scenarioId: string) {
  const scenario = await getScenario(lab, scenarioId);
  const doc = createReport(
    `Who quenches: ${scenario.name}`,
    `${lab.name} · reaction scenario · last changed ${scenario.updatedAt.slice(0, 16).replace('T', ' ')} UTC`,
  );
  facts(doc, [
    ['Emitter', scenario.emitter.name],
    ['Solvent', scenario.solvent],
    ['tau0', `${fixed(scenario.tau0 * 1e9, 4)} ns${scenario.tau0Source ? ` (${scenario.tau0Source})` : ''}`],
  ]);
  heading(doc, 'Share of excited emitter intercepted');
  table(
    doc,
    ['Component', 'In reaction (mM)', 'kq (M^-1 s^-1)', 'kq from', 'Share'],
    [
      ...scenario.shares.map((share) => [
        share.label,
        fixed(share.concentration * 1e3, 4),
        share.kq === null
          ? 'none'
          : `${sci(share.kq)}${share.kqStandardError ? ` ± ${sci(share.kqStandardError, 2)}` : ''}`,
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

/** A lab summary of a comparison: the table and the Rehm–Weller trend per solvent. */
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
      'kq (M^-1 s^-1)',
      'K_SV (M^-1)',
      'Solvent',
      'dG_ET (eV)',
      'Status',
      'Flags',
    ],
    comparison.rows.map((row) => [
      row.partner.name,
      row.kq ? `${sci(row.kq.value)}${row.kq.standardError ? ` ± ${sci(row.kq.standardError, 2)}` : ''}` : '—',
      row.kSv ? fixed(row.kSv.value, 4) : '—',
      row.solvent,
      row.drivingForce ? `${fixed(row.drivingForce.electronvolts, 3)} (${row.drivingForce.pathway})` : 'missing',
      row.status,
      row.flags.map((flag) => flag.title).join('; '),
    ]),
    [80, 85, 55, 60, 70, 50, 95],
  );
  heading(doc, 'kq against driving force, per solvent');
  for (const trend of comparison.trends) {
    doc.text(
      trend.fit
        ? `${trend.solvent}: reorganisation energy ${fixed(trend.fit.reorganisationEnergy, 3)} ± ${fixed(trend.fit.reorganisationEnergyStandardError, 2)} eV from ${trend.fit.n} studies (k_d ${sci(trend.diffusionLimit)} M^-1 s^-1).`
        : `${trend.solvent}: no fit (${trend.note}).`,
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
