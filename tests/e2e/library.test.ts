import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoLibrary } from '../../server/seed/demo-library';
import { createLabWithMembers } from '../support/accounts';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let browser: Browser;
let server: Awaited<ReturnType<typeof startLiveServer>>;
let researcher: { email: string; password: string };
let admin: { email: string; password: string };
let labId: string;

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(screenshotDir, name), fullPage: true });

const signIn = (page: Page, person: { email: string; password: string }) =>
  signInThroughPage(page, server.baseUrl, person);

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  const { lab, users } = await createLabWithMembers(server.sequelize, { roles: ['researcher', 'admin'] });
  researcher = users.researcher;
  admin = users.admin;
  labId = lab.id;
  // The invented demo library (HL-Ir-7 and friends) gives the new quencher emitters to pair with.
  await server.sequelize.transaction((transaction) => seedDemoLibrary(transaction, { marram: lab }));
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('compound library in Chromium', () => {
  it('when a potential is added against Fc+/Fc, then it shows against SCE and the pair’s driving force is on screen', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, researcher);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Library' }).click();
    await page.getByRole('heading', { name: 'Library', level: 1 }).waitFor();
    await page.getByRole('link', { name: 'HL-Ir-7' }).waitFor();
    await shot(page, 'library-list.png');

    const add = page.getByRole('form', { name: 'Add compound' });
    await add.getByLabel('Name or code').fill('E2E-Q-9');
    await add.getByLabel('Used as').selectOption('quencher');
    await add.getByRole('button', { name: 'Add compound' }).click();
    await page.getByRole('heading', { name: 'E2E-Q-9', level: 1 }).waitFor();
    expect(page.url()).toContain(`/labs/${labId}/library/`);

    const potential = page.getByRole('form', { name: 'Add a redox potential' });
    await potential.getByLabel('Couple').selectOption('reduction');
    await potential.getByLabel('Potential (V)').fill('not a number');
    await potential.getByRole('button', { name: 'Save potential' }).click();
    await potential.getByText(/must be a number in volts/).waitFor();
    await potential.getByLabel('Potential (V)').fill('-2.00');
    await potential.getByLabel('Reference electrode').selectOption('Fc+/Fc');
    await potential.getByLabel('Source (DOI or notebook page)').fill('Notebook E2E p. 12');
    await potential.getByRole('button', { name: 'Save potential' }).click();

    const potentials = page.getByRole('region', { name: 'Redox potentials' });
    // −2.00 V vs Fc+/Fc + 0.380 V (Pavlishchuk & Addison, Inorg. Chim. Acta 2000) = −1.62 V vs SCE.
    await potentials.getByRole('cell', { name: '−1.62 V' }).waitFor();
    await potentials.getByRole('cell', { name: '−2.00 V vs Fc+/Fc' }).waitFor();
    await potentials.getByText('Notebook E2E p. 12').waitFor();
    await expect.poll(() => potentials.getByRole('note').count()).toBeGreaterThan(0);

    const pair = page.getByRole('region', { name: 'Driving force with a partner' });
    await pair.getByLabel('Emitter').selectOption({ label: 'HL-Ir-7' });
    const oxidative = pair.getByRole('region', { name: 'Oxidative quenching' });
    // HL-Ir-7 (demo): E(PC+/PC) +1.21 V vs SCE, E00 = 1239.84198/475 nm = 2.610 eV (CODATA hc/e);
    // dG = 1.21 − (−1.62) − 2.610 = +0.22 eV, by hand from the Rehm–Weller form of shared/engine/README.md, section 6.
    await oxidative.getByText('+0.22 eV', { exact: false }).first().waitFor();
    await pair.getByText('More favourable').waitFor();
    const reductive = pair.getByRole('region', { name: 'Reductive quenching' });
    await reductive.getByText(/E2E-Q-9 has no ground-state oxidation potential/).waitFor();
    await oxidative.getByRole('button', { name: 'Pin as the expected mechanism' }).click();
    await oxidative.getByText('Pinned as expected').waitFor();
    await pair.scrollIntoViewIfNeeded();
    await shot(page, 'library-compound-driving-force.png');

    await page.goto(`${server.baseUrl}/labs/${labId}/library`);
    await page.getByRole('link', { name: 'HL-Ir-7' }).click();
    await page.getByRole('region', { name: 'Excited-state potentials' }).getByText('E*(PC+/PC*)').waitFor();
    // Demo records were entered by nobody in this lab: a researcher may read them, not change them.
    expect(
      await page.getByRole('region', { name: 'Redox potentials' }).getByRole('button', { name: /^Edit/ }).count(),
    ).toBe(0);
    await shot(page, 'library-emitter.png');
  });

  it('when an admin reads potentials against Fc+/Fc and imports a file with a bad row, then the row is reported and nothing saved', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, admin);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Lab settings' }).click();
    await page.getByLabel('Display reference electrode').selectOption('Fc+/Fc');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Potentials are now read against Fc+/Fc').waitFor();
    await shot(page, 'library-settings.png');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Library' }).click();
    await page.getByRole('link', { name: 'HL-Ir-7' }).click();
    const potentials = page.getByRole('region', { name: 'Redox potentials' });
    // Demo HL-Ir-7: +1.21 V vs SCE − 0.380 V (Pavlishchuk & Addison, Inorg. Chim. Acta 2000) = +0.83 V vs Fc+/Fc.
    await potentials.getByRole('cell', { name: '+0.83 V' }).waitFor();
    await potentials.getByRole('cell', { name: '+1.21 V vs SCE' }).waitFor();

    await page.goto(`${server.baseUrl}/labs/${labId}/library`);
    const csv = [
      'record,compound,role_hint,couple,potential_v,reference,kind,solvent',
      'compound,E2E-CSV-1,quencher,,,,,',
      'potential,E2E-CSV-1,,reduction,-1.1,Hg/HgO,half-wave,acetonitrile',
    ].join('\n');
    await page
      .getByLabel('CSV file to import')
      .setInputFiles({ name: 'bad-row.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    const problems = page.getByRole('region', { name: 'Problems in the file' });
    await problems.getByRole('cell', { name: 'reference', exact: true }).waitFor();
    await problems.getByRole('cell', { name: '3', exact: true }).waitFor();
    await shot(page, 'library-import-problems.png');
    await expect.poll(async () => page.getByRole('link', { name: 'E2E-CSV-1' }).count()).toBe(0);
  });
});
