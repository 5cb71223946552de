import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pointAt } from '@shared/schemas/study-points';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { launchBrowser, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';
import { createStudy } from '../support/studies';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let people: Awaited<ReturnType<typeof createLabWithMembers>>['users'];
let labId = '';

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  const created = await createLabWithMembers(server.sequelize, { roles: ['researcher'] });
  people = created.users;
  labId = created.lab.id;
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

interface Drawn {
  xTitle: string;
  yTitle: string;
  leftOut: Array<{ x: number; y: number }>;
  /** where Chart.js put each left-out marker, and where the axes put its value, in pixels */
  pixels: Array<{ drawn: [number, number]; axes: [number, number] }>;
}

/** The data of the Stern–Volmer chart as the page holds it: Chart.js's own datasets, scales and drawn elements. */
function readChart(page: Page): Promise<Drawn> {
  return page.evaluate(() => {
    const canvas = document.querySelector('figure[aria-label="Stern–Volmer plot"] canvas')!;
    const fiberKey = Object.keys(canvas).find((key) => key.startsWith('__reactFiber$'))!;
    type Fiber = { memoizedProps?: { ref?: { current?: { data?: { datasets?: unknown } } } }; return?: Fiber };
    let fiber: Fiber | undefined = (canvas as unknown as Record<string, Fiber>)[fiberKey];
    // up from the canvas to the component whose ref holds the Chart.js instance
    while (fiber && !fiber.memoizedProps?.ref?.current?.data?.datasets) fiber = fiber.return;
    type Point = { x: number; y: number };
    const chart = fiber!.memoizedProps!.ref!.current as unknown as {
      data: { datasets: Array<{ label: string; data: Point[] }> };
      options: { scales: Record<'x' | 'y', { title: { text: string } }> };
      scales: Record<'x' | 'y', { getPixelForValue(value: number): number }>;
      getDatasetMeta(index: number): { data: Point[] };
    };
    const index = chart.data.datasets.findIndex((set) => set.label === 'Left out');
    const leftOut = chart.data.datasets[index]!.data;
    return {
      xTitle: chart.options.scales.x.title.text,
      yTitle: chart.options.scales.y.title.text,
      leftOut,
      pixels: chart.getDatasetMeta(index).data.map((element, i) => ({
        drawn: [element.x, element.y] as [number, number],
        axes: [chart.scales.x.getPixelForValue(leftOut[i]!.x), chart.scales.y.getPixelForValue(leftOut[i]!.y)] as [
          number,
          number,
        ],
      })),
    };
  });
}

async function expectMarker(page: Page, xTitle: string, x: number, y: number) {
  const drawn = await readChart(page);
  expect(drawn.xTitle).toBe(xTitle);
  expect(drawn.leftOut).toEqual([{ x: expect.closeTo(x, 5), y: expect.closeTo(y, 5) }]);
  const [{ drawn: at, axes }] = drawn.pixels as [Drawn['pixels'][number]];
  expect(at[0]).toBeCloseTo(axes[0], 3);
  expect(at[1]).toBeCloseTo(axes[1], 3);
}

describe('left-out points in Chromium (issue 13, finding 11)', () => {
  it('when a point is left out, then the plot draws it where it belongs under every model, with corrections on and for ratio data', async () => {
    const api = await apiClient(server.baseUrl);
    await api.signIn(people.researcher);
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInThroughPage(page, server.baseUrl, people.researcher);
    const open = async (studyId: string) => {
      await page.goto(`${server.baseUrl}/labs/${labId}/studies/${studyId}`);
      // the plots are drawn after the screen's first paint (src/lib/after-paint.ts)
      await page.locator('figure[aria-label="Stern–Volmer plot"] canvas').first().waitFor();
    };

    // Invented series I0/I = (1 + 300 [Q])(1 + 100 [Q]); the 4 mM point left out. Hand-computed:
    // I0/I at 4 mM = 2.2 × 1.4 = 3.08; modified plot: 1/[Q] = 250 M⁻¹ = 0.25 mM⁻¹, I0/(I0 − I) = 3.08/2.08.
    const curved = [0, 1e-3, 2e-3, 4e-3, 6e-3, 8e-3, 10e-3].map((q) => ({
      ...pointAt(q),
      intensity: 1000 / ((1 + 300 * q) * (1 + 100 * q)),
      ...(q === 4e-3 ? { excluded: true, exclusionReason: 'bubble in the cell' } : {}),
    }));
    const study = await createStudy(api, labId, 'marks', { tau0: null, tau0Uncertainty: null });
    const base = `/api/labs/${labId}/studies/${study.id}`;
    expect((await api.patch(`${base}/points`, { version: 0, points: curved })).status).toBe(200);
    for (const model of ['linear-free', 'linear-fixed', 'static-dynamic'] as const) {
      expect((await api.post(`${base}/fits`, { model })).status).toBe(201);
      await open(study.id);
      await expectMarker(page, '[Q] (mM)', 4, 3.08);
    }
    expect((await api.post(`${base}/fits`, { model: 'modified' })).status).toBe(201);
    await open(study.id);
    await expectMarker(page, '1/[Q] (mM⁻¹)', 0.25, 3.08 / 2.08);
    expect((await readChart(page)).yTitle).toBe('I0/(I0 − I)');

    // Dilution on (V0 = 2.000 mL, 0.100 M stock, 40 µL added at the left-out point). Hand-computed:
    // [Q] = 0.1 × 40e-6 / 2.04e-3 = 1.960784 mM; I_corr = 495.0495 × 2.04/2.00 = 504.9505; I0/I = 1.980392.
    const added = [0, 20e-6, 40e-6, 60e-6, 80e-6];
    const observed = [1000, 662.2517, 495.0495, 395.2569, 328.9474];
    const diluted = await createStudy(api, labId, 'marks-dilution', {
      dilutionCorrection: true,
      initialVolume: 2e-3,
      stockConcentration: 0.1,
    });
    const titration = added.map((volume, i) => ({
      ...pointAt((0.1 * volume) / 2e-3),
      intensity: observed[i]!,
      volumeAdded: volume,
      ...(i === 2 ? { excluded: true, exclusionReason: 'lamp flicker' } : {}),
    }));
    const dilutedBase = `/api/labs/${labId}/studies/${diluted.id}`;
    expect((await api.patch(`${dilutedBase}/points`, { version: 0, points: titration })).status).toBe(200);
    await open(diluted.id);
    await expectMarker(page, '[Q] (mM)', 1.960784, 1.980392);

    // Ratio data: I0/I = 1 + 800 [Q] entered as ratios, the 3 mM ratio (3.4) left out.
    const ratios = await createStudy(api, labId, 'marks-ratio', { dataKind: 'ratio' });
    const ratioPoints = [0, 1e-3, 2e-3, 3e-3, 4e-3, 5e-3].map((q) => ({
      ...pointAt(q),
      intensity: 1 + 800 * q,
      ...(q === 3e-3 ? { excluded: true, exclusionReason: 'typed twice' } : {}),
    }));
    expect(
      (await api.patch(`/api/labs/${labId}/studies/${ratios.id}/points`, { version: 0, points: ratioPoints })).status,
    ).toBe(200);
    await open(ratios.id);
    await expectMarker(page, '[Q] (mM)', 3, 3.4);
    await page.close();
  });
});
