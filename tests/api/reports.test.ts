import { PDFParse } from 'pdf-parse';
import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Lab, Study } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { formatEstimate, replicateRunsText, weightingText } from '@shared/format';
import { fitModelNames, type FitModel } from '@shared/schemas/studies';
import { chartInk } from '../../server/services/reports/report-charts';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { pixelsOfColour, renderPdfPages } from '../support/pdf-pages';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

let client: Awaited<ReturnType<typeof apiClient>>;
let labId = '';
// Studies this file makes go to a lab of its own: the demo lab's overview (tests/api/demo-studies.test.ts)
// shows its newest 20 events, and events made here in the same run would push the demo's story out.
let own: Awaited<ReturnType<typeof apiClient>>;
let ownLabId = '';

async function pdfText(buffer: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(buffer) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

const binary = (response: { body: unknown }) => response.body as Buffer;
// Rendered report pages are saved beside the browser screenshots, for a person to look at.
const reportShots = 'test-output/reports';

beforeAll(async () => {
  await seedDemoData(testApp.sequelize);
  labId = (await Lab.findOne({ where: { slug: demoLabs[0].slug } }))!.id;
  client = await apiClient(testApp.app);
  await client.signIn({ email: demoPeople[0]!.email, password: demoPassword });
  const ownLab = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
  ownLabId = ownLab.lab.id;
  own = await apiClient(testApp.app);
  await own.signIn(ownLab.users.researcher!);
});

const pdfOf = (url: string, by = client) =>
  by.agent
    .get(url)
    .buffer(true)
    .parse((res, callback) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => callback(null, Buffer.concat(chunks)));
    });

describe('lab summary reports', () => {
  it('when a scenario and a comparison are reported, then their PDFs carry the shares and the table rows', async () => {
    const study = (await Study.findOne({ where: { labId, isCurrent: true, status: 'approved' } }))!;
    const scenario = (
      await client.post(`/api/labs/${labId}/scenarios`, {
        name: 'Report check',
        emitterId: study.emitterId,
        solvent: 'acetonitrile',
        tau0: 1e-6,
        components: [{ compoundId: study.quencherId, concentration: 0.02 }],
      })
    ).body;
    const scenarioPdf = binary(await pdfOf(`/api/labs/${labId}/scenarios/${scenario.id}/report.pdf`));
    const scenarioText = (await pdfText(scenarioPdf)).replace(/\s+/g, ' ');
    expect(scenarioText).toContain('Who quenches: Report check');
    expect(scenarioText).toContain(`${(scenario.shares[0].fraction * 100).toFixed(1)} %`);
    expect(scenarioText).toContain(scenario.caution);

    const comparison = (await client.get(`/api/labs/${labId}/comparisons/emitter/${study.emitterId}`)).body;
    const comparisonPdf = binary(await pdfOf(`/api/labs/${labId}/comparisons/emitter/${study.emitterId}/report.pdf`));
    const comparisonText = (await pdfText(comparisonPdf)).replace(/\s+/g, ' ');
    expect(comparisonText).toContain(`Comparison: ${comparison.compound.name}`);
    for (const row of comparison.rows) expect(comparisonText).toContain(row.partner.name);
    // Driving forces and axis ticks below zero with the true minus sign U+2212 (typeset practice).
    for (const text of [scenarioText, comparisonText]) expect(text).not.toMatch(/(?<![\w.])-\d/);
    expect(comparisonText).toMatch(/−\d/);
    // The driving force in the table header and on the chart's axis as ΔG with subscript e and t
    // (U+2091, U+209C, Unicode's subscript letters; there are no capital ones), never ΔG_ET.
    expect(comparisonText).toContain('ΔG\u2091\u209c (eV)');
    expect(comparisonText).not.toContain('ΔG_ET');
  });

  it('when a scenario and a comparison are reported, then each PDF draws its chart in the screen colours', async () => {
    const study = (await Study.findOne({ where: { labId, isCurrent: true, status: 'approved' } }))!;
    const scenario = (
      await client.post(`/api/labs/${labId}/scenarios`, {
        name: 'Chart check',
        emitterId: study.emitterId,
        solvent: 'acetonitrile',
        tau0: 1e-6,
        components: [{ compoundId: study.quencherId, concentration: 0.02 }],
      })
    ).body;
    expect(scenario.shares[0].fraction).toBeGreaterThan(0.01);
    const scenarioPages = renderPdfPages(
      binary(await pdfOf(`/api/labs/${labId}/scenarios/${scenario.id}/report.pdf`)),
      reportShots,
      'scenario',
    );
    // The quencher's bar in glow and the unquenched rest in paper, as in the screen's bar chart.
    expect(pixelsOfColour(scenarioPages[0]!, chartInk.points, 12)).toBeGreaterThan(30);
    expect(pixelsOfColour(scenarioPages[0]!, chartInk.unquenched, 6)).toBeGreaterThan(30);

    const comparison = (await client.get(`/api/labs/${labId}/comparisons/emitter/${study.emitterId}`)).body;
    expect(comparison.trends.some((trend: { points: unknown[] }) => trend.points.length > 0)).toBe(true);
    const comparisonPages = renderPdfPages(
      binary(await pdfOf(`/api/labs/${labId}/comparisons/emitter/${study.emitterId}/report.pdf`)),
      reportShots,
      'comparison',
    );
    // The first solvent's points and lines in its hue, on grid lines in paper.
    const drawn = comparisonPages.reduce((sum, page) => sum + pixelsOfColour(page, chartInk.series[0]!, 12), 0);
    expect(drawn).toBeGreaterThan(20);
  });
});

describe('GET /api/labs/:labId/studies/:studyId/report.pdf', () => {
  it('when a demo study with a fit is reported, then its PDF text holds the fitted numbers, flags and engine version', async () => {
    const study = await Study.findOne({ where: { labId, isCurrent: true, status: 'approved' } });
    expect(study, 'the demo lab has an approved study').not.toBeNull();
    const detail = (await client.get(`/api/labs/${labId}/studies/${study!.id}`)).body;
    const response = await client.agent
      .get(`/api/labs/${labId}/studies/${study!.id}/report.pdf`)
      .buffer(true)
      .parse((res, callback) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => callback(null, Buffer.concat(chunks)));
      });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    const text = (await pdfText(binary(response))).replace(/\s+/g, ' ');
    const kSv = detail.latestFit.result.parameters.kSv;
    // The shared formatter's rounding to the SE (tests/unit/format) and Unicode units, as on screen.
    expect(text).toContain(`K_SV: ${formatEstimate(kSv.value, kSv.standardError, 'M⁻¹')}`);
    const kq = detail.latestFit.result.parameters.kq;
    expect(text).toContain(`kq: ${formatEstimate(kq.value, kq.standardError, 'M⁻¹ s⁻¹')}`);
    expect(text).not.toContain('^-1');
    expect(text).toContain('× 10');
    expect(text).not.toMatch(/\de[+-]\d/);
    // A title may wrap after a hyphen in the PDF ("Q-" / "borate-9"): join such breaks before comparing.
    expect(text.replace(/-\s/g, '-')).toContain(detail.title);
    expect(text).toContain(`engine ${detail.latestFit.engineVersion}`);
    // The model in words as on screen, never its stored key ("linear-free").
    expect(text).toContain(`Model: ${fitModelNames[detail.latestFit.model as FitModel]}`);
    expect(text).not.toContain(detail.latestFit.model);
    // Which weighting gave K_SV, in the words of the screen and the CSV (shared/format weightingText).
    expect(text).toContain(`Weighting: ${weightingText(detail.latestFit.result.weighting)}`);
    // Negative numbers with the true minus sign U+2212 (typeset practice, as in shared/format), never "-0.6 eV".
    expect(text).not.toMatch(/(?<![\w.])-\d/);
    expect(text).toMatch(/−\d/);
    expect(text).toMatch(/Approved: by .+ on \d{4}-\d{2}-\d{2}/);
    for (const upload of detail.uploads) expect(text).toContain(upload.sha256);
    // The plot as on screen: points in glow, the fitted line in ink (the colours used to be swapped).
    const pages = renderPdfPages(binary(response), reportShots, 'study');
    expect(pages.reduce((sum, page) => sum + pixelsOfColour(page, chartInk.points, 12), 0)).toBeGreaterThan(20);
  });

  it('when a demo study has lifetimes, then the report carries the lifetime K_SV as fitted', async () => {
    const studies = await Study.findAll({ where: { labId, isCurrent: true } });
    let withLifetimes: { id: string; kSv: { value: number; standardError: number } } | null = null;
    for (const study of studies) {
      const detail = (await client.get(`/api/labs/${labId}/studies/${study.id}`)).body;
      if (detail.latestFit?.result.lifetime)
        withLifetimes = { id: study.id, kSv: detail.latestFit.result.lifetime.kSv };
    }
    expect(withLifetimes, 'the demo lab has a study with lifetimes').not.toBeNull();
    const response = await client.agent
      .get(`/api/labs/${labId}/studies/${withLifetimes!.id}/report.pdf`)
      .buffer(true)
      .parse((res, callback) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => callback(null, Buffer.concat(chunks)));
      });
    const text = (await pdfText(binary(response))).replace(/\s+/g, ' ');
    expect(text).toContain(
      `K_SV from lifetimes: ${formatEstimate(withLifetimes!.kSv.value, withLifetimes!.kSv.standardError, 'M⁻¹')}`,
    );
  });

  it("when a study has a kept decay set, then the report lists each decay with its τ and SE, the set's τ0 and lifetime K_SV, and draws the decays from the kept file", async () => {
    const study = (await Study.findOne({
      where: { labId, isCurrent: true, title: { [Op.like]: '%lifetimes from decays' } },
    }))!;
    const [set] = (await client.get(`/api/labs/${labId}/studies/${study.id}/decay-sets`).expect(200)).body.items;
    const pdf = binary(await pdfOf(`/api/labs/${labId}/studies/${study.id}/report.pdf`));
    const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
    expect(text).toContain(`Decays: ${set.title}`);
    expect(text).toContain(set.file.sha256);
    // The same numbers the screen shows, through the shared formatter (tests/unit/format).
    const { tau0, kSv } = set.sternVolmer;
    expect(text).toContain(`τ0 from the blank: ${formatEstimate(tau0.value * 1e9, tau0.standardError * 1e9, 'ns')}`);
    expect(text).toContain(`Lifetime K_SV: ${formatEstimate(kSv.value, kSv.standardError, 'M⁻¹')}`);
    for (const outcome of set.outcomes) {
      expect(text).toContain(`Decay ${outcome.label}`);
      expect(text).toContain(formatEstimate(outcome.lifetime.value * 1e9, outcome.lifetime.standardError * 1e9, ''));
    }
    expect(text).toContain('Lifetime Stern–Volmer plot of the set');
    expect(text).toContain('weighted residual');
    // Drawn: the response in violet and the weighted residuals in brick, as on screen (decay-chart-setup.ts).
    const pages = renderPdfPages(pdf, reportShots, 'study-decays', 100);
    expect(pages.reduce((sum, page) => sum + pixelsOfColour(page, chartInk.band, 12), 0)).toBeGreaterThan(50);
    expect(pages.reduce((sum, page) => sum + pixelsOfColour(page, chartInk.excluded, 12), 0)).toBeGreaterThan(200);
  });

  it('when a study holds lifetimes only, then the report says there is no intensity data and draws the tau0/tau line it was fitted with', async () => {
    const study = await createStudy(own, ownLabId, 'report-lifetimes-only');
    // tau = 1 µs / (1 + 500 [Q]) (Lakowicz 3rd ed. eq. 8.2, numbers constructed) with a small invented scatter.
    const scatter = [0, 0.01, -0.008, 0.012, -0.006, 0.004];
    const points = exactPoints.map((p, i) => ({
      ...p,
      intensity: null,
      lifetime: 1e-6 / (1 + 500 * p.concentration + scatter[i]!),
    }));
    const base = `/api/labs/${ownLabId}/studies/${study.id}`;
    expect((await own.patch(`${base}/points`, { version: 0, points })).status).toBe(200);
    const detail = (await own.get(base).expect(200)).body;
    expect(detail.fitProblem).toBeNull();
    expect(Math.abs(detail.latestFit.kSv / 500 - 1)).toBeLessThan(0.02);
    const pdf = binary(await pdfOf(`${base}/report.pdf`, own));
    const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
    expect(text).toContain(
      'Intensity fit: no intensity data: K_SV and kq come from the lifetime Stern–Volmer fit (τ0/τ)',
    );
    expect(text).toContain('K_SV from lifetimes (τ0/τ)');
    expect(text).not.toContain('No fit:');
    // No lifetime-against-intensity verdict: the only line is the lifetime one.
    expect(text).not.toContain('from intensities against');
    // Drawn: the points in amber on the Stern–Volmer plot and again on the lifetime plot.
    const pages = renderPdfPages(pdf, reportShots, 'study-lifetimes-only', 100);
    // Every page carries more than its footer: the residual strip no longer spills its labels one per page.
    expect(text).not.toMatch(/-- \d+ of \d+ -- \d Halflight/);
    expect(pages.reduce((sum, page) => sum + pixelsOfColour(page, chartInk.points, 12), 0)).toBeGreaterThan(100);
  });

  it('when a modified fit with a left-out point is reported, then the x axis reads 1/[Q] with its unit and the cross is drawn (issue 13, finding 11)', async () => {
    const study = await createStudy(own, ownLabId, 'report-axis');
    const points = exactPoints.map((p, i) => (i === 3 ? { ...p, excluded: true, exclusionReason: 'bubble' } : p));
    expect((await own.patch(`/api/labs/${ownLabId}/studies/${study.id}/points`, { version: 0, points })).status).toBe(
      200,
    );
    expect((await own.post(`/api/labs/${ownLabId}/studies/${study.id}/fits`, { model: 'modified' })).status).toBe(201);
    const pdf = binary(await pdfOf(`/api/labs/${ownLabId}/studies/${study.id}/report.pdf`, own));
    const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
    // the stored series' axis (shared/engine/study-fit): 1/[Q] in mM⁻¹ on the plot and the residuals beneath
    expect(text.match(/1\/\[Q\] \(mM⁻¹\)/g)).toHaveLength(2);
    // 150 dpi: the cross is two 1.2 pt strokes, thinner than a pixel at the default 60 dpi
    const pages = renderPdfPages(pdf, reportShots, 'study-modified', 150);
    expect(pages.reduce((sum, page) => sum + pixelsOfColour(page, chartInk.excluded, 12), 0)).toBeGreaterThan(10);
  });

  it('when a study pools replicate runs, then the PDF and the CSVs carry each run, the mean ± SD per [Q] and the weighting', async () => {
    const study = await createStudy(own, ownLabId, 'report-runs');
    // Two runs of the constructed line 1 + 500 [Q], run 2 with the lamp at 80 % and a 2 % scatter (invented).
    const run2 = exactPoints.map((p, i) => ({
      ...p,
      series: 2,
      intensity: p.intensity! * 0.8 * (1 + [0, 0.02, -0.02, 0.02, -0.02, 0.02][i]!),
    }));
    const points = [...exactPoints, ...run2];
    const base = `/api/labs/${ownLabId}/studies/${study.id}`;
    expect((await own.patch(`${base}/points`, { version: 0, points })).status).toBe(200);
    const fit = (await own.post(`${base}/fits`, { model: 'linear-free', weighting: 'weighted' })).body;
    const { replicates } = fit.result;
    const text = (await pdfText(binary(await pdfOf(`${base}/report.pdf`, own)))).replace(/\s+/g, ' ');
    expect(text).toContain(`${replicateRunsText(replicates)}.`);
    expect(text).toContain(`Weighting: ${weightingText(fit.result.weighting)}`);
    expect(text).toContain('I0/I mean ± SD');
    // 1 mM: run 1 gives 1.5, run 2 1.5/1.02; mean ± sample SD as the shared formatter writes them
    const atOne = replicates.summary.find((row: { concentration: number }) => row.concentration === 1e-3);
    expect(text).toContain(formatEstimate(atOne.mean, atOne.sd, ''));

    const pointsCsv = (await own.get(`${base}/export.csv?part=points`).expect(200)).text.split('\n');
    expect(pointsCsv[0]).toMatch(/^\ufeff?position,run,/); // after the UTF-8 byte-order mark
    expect(pointsCsv[7]).toMatch(/^7,2,/); // the first reading of run 2
    const fitCsv = (await own.get(`${base}/export.csv?part=fit`).expect(200)).text;
    expect(fitCsv).toMatch(/^run_2_i0,800,/m); // run 2's blank: 1000 × 0.8
    expect(fitCsv).toMatch(/^kSv_weighted,/m);
    expect(fitCsv).toMatch(/^kSv_unweighted,/m);
    expect(fitCsv).toMatch(/^ratio_mean_at_0.001_M,/m);
  });

  it('when a line through 1 is reported, then the PDF labels its R² as uncentred beside the centred one and says what each SE includes', async () => {
    const studies = await Study.findAll({ where: { labId, isCurrent: true } });
    let fixedId: string | null = null;
    for (const study of studies) {
      const detail = (await client.get(`/api/labs/${labId}/studies/${study.id}`)).body;
      if (detail.latestFit?.model === 'linear-fixed') fixedId = study.id;
    }
    expect(fixedId, 'the demo lab has a line through 1').not.toBeNull();
    const detail = (await client.get(`/api/labs/${labId}/studies/${fixedId}`)).body;
    const { statistics, parameters } = detail.latestFit.result;
    expect(statistics.rSquaredDefinition).toBe('uncentred');
    const text = (await pdfText(binary(await pdfOf(`/api/labs/${labId}/studies/${fixedId}/report.pdf`)))).replace(
      /\s+/g,
      ' ',
    );
    expect(text).toContain(`R² about 1 (uncentred): ${statistics.rSquared.toFixed(4)}`);
    expect(text).toContain(`centred R² of the same line: ${statistics.rSquaredCentred.toFixed(4)}`);
    expect(text).toContain(`SE includes ${parameters.kSv.includes}`);
    const csv = await client.get(`/api/labs/${labId}/studies/${fixedId}/export.csv?part=fit`);
    expect(csv.text).toContain('standard_error_includes');
    expect(csv.text).toMatch(/r_squared_uncentred,[\d.]+,/);
    expect(csv.text).toContain('R² about 1 (uncentred)');
    expect(csv.text).toMatch(/r_squared_centred,-?[\d.]+/);
  });

  it('when the study is unknown, then 404 in the one error shape', async () => {
    const response = await client.get(`/api/labs/${labId}/studies/00000000-0000-4000-8000-000000000000/report.pdf`);
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('not_found');
  });
});
