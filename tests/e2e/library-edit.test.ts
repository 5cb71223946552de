import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { launchBrowser, screenshotDir, signInThroughPage } from '../support/browser';
import { startLiveServer } from '../support/live-server';
import { exactPoints } from '../support/studies';

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
  fs.mkdirSync(screenshotDir, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('correcting library records in Chromium', () => {
  it('when a researcher corrects their potential, E00 and lifetime, then the studies using the lifetime are listed and one is refitted on request', async () => {
    const api = await apiClient(server.baseUrl);
    await api.signIn(researcher);
    const reviewerApi = await apiClient(server.baseUrl);
    await reviewerApi.signIn(admin);
    const base = `/api/labs/${labId}`;
    const emitter = (await api.post(`${base}/compounds`, { name: 'E2E-Ir-5', roleHint: 'photocatalyst' })).body;
    const records = `${base}/compounds/${emitter.id}`;
    expect(
      (
        await api.post(`${records}/potentials`, {
          couple: 'oxidation',
          value: 1.1,
          reference: 'SCE',
          solvent: 'acetonitrile',
          kind: 'half-wave',
        })
      ).status,
    ).toBe(201);
    const energy = (await api.post(`${records}/energies`, { value: 2.5, method: 'emission onset' })).body;
    const lifetime = (
      await api.post(`${records}/lifetimes`, {
        value: 1e-6,
        uncertainty: 2e-8,
        solvent: 'acetonitrile',
        atmosphere: 'argon',
        method: 'TCSPC',
      })
    ).body;
    const study = async (title: string) => {
      const created = (
        await api.post(`${base}/studies`, {
          title,
          emitterId: emitter.id,
          newQuencherName: `Q for ${title}`,
          solventId: 'acetonitrile',
          atmosphere: 'argon',
          degassingMethod: 'sparging',
          tau0LifetimeId: lifetime.id,
        })
      ).body;
      return (
        await api.patch(`${base}/studies/${created.id}/points`, { version: created.version, points: exactPoints })
      ).body as { id: string };
    };
    const draft = await study('E2E refit draft');
    const approved = await study('E2E approved');
    await api.post(`${base}/studies/${approved.id}/submit`, {});
    expect((await reviewerApi.post(`${base}/studies/${approved.id}/approve`, { comment: 'Fine' })).status).toBe(200);

    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, researcher);
    await page.goto(`${server.baseUrl}/labs/${labId}/library/${emitter.id}`);
    const potentials = page.getByRole('region', { name: 'Redox potentials' });
    await potentials.getByRole('button', { name: 'Edit oxidation potential 1.1 V' }).click();
    const editPotential = page.getByRole('form', { name: 'Edit the redox potential' });
    await editPotential.getByLabel('Potential (V)').fill('1.1.5');
    await editPotential.getByRole('button', { name: 'Save changes' }).click();
    await editPotential.getByText(/must be a number in volts/).waitFor();
    await shot(page, 'library-edit-potential.png');
    await editPotential.getByLabel('Potential (V)').fill('1,15');
    await editPotential.getByRole('button', { name: 'Save changes' }).click();
    await potentials.getByRole('cell', { name: '+1.15 V vs SCE' }).waitFor();

    // Someone else changes the E00 while this page still holds version 0: the save is refused in plain words.
    await page.getByRole('button', { name: 'Edit E00 2.50 eV' }).click();
    await api.patch(`${records}/energies/${energy.id}`, {
      method: 'absorption/emission crossing',
      version: energy.version,
    });
    const editEnergy = page.getByRole('form', { name: 'Edit E00' });
    await editEnergy.getByLabel('Entered as').selectOption('nm');
    await editEnergy.getByLabel('E00', { exact: true }).fill('500');
    await editEnergy.getByRole('button', { name: 'Save changes' }).click();
    await editEnergy.getByText(/changed by someone else since you opened it/).waitFor();
    await shot(page, 'library-edit-e00-stale.png');
    await editEnergy.getByRole('button', { name: 'Cancel' }).click();
    await page.getByRole('button', { name: 'Edit E00 2.50 eV' }).click();
    await editEnergy.getByLabel('Entered as').selectOption('nm');
    await editEnergy.getByLabel('E00', { exact: true }).fill('500');
    await editEnergy.getByRole('button', { name: 'Save changes' }).click();
    // 1239.84198 eV nm / 500 nm = 2.480 eV (CODATA hc/e).
    await page.getByRole('list', { name: 'E00 values' }).getByText('2.48 eV').waitFor();

    const lifetimes = page.getByRole('list', { name: 'Lifetimes' });
    await lifetimes.getByRole('button', { name: 'Edit' }).click();
    const editLifetime = page.getByRole('form', { name: 'Edit the lifetime' });
    await editLifetime.getByLabel('Lifetime', { exact: true }).fill('0,85');
    await editLifetime.getByRole('button', { name: 'Save changes' }).click();
    const dependents = page.getByRole('region', { name: 'Studies using this lifetime' });
    await dependents.getByText(/2 studies take τ0 from this record \(850 ns/).waitFor();
    await dependents.getByText(/Approved and locked: start a new revision/).waitFor();
    await shot(page, 'library-lifetime-dependents.png');
    await dependents.getByRole('button', { name: 'Refit E2E refit draft' }).click();
    await dependents.getByText('Refitted with the new τ0').waitFor();
    // Only the approved study still holds the old value once the list is read again.
    await dependents.getByText(/; 1 still holds an older value/).waitFor();
    const refitted = (await api.get(`${base}/studies/${draft.id}`)).body;
    // The tau0 change itself refits the study (the studies API refits on every change): one new fit, not two.
    expect(refitted).toMatchObject({ tau0: 8.5e-7, latestFit: { trigger: 'auto' } });
    const fits = (await api.get(`${base}/studies/${draft.id}/fits`)).body.items;
    expect(fits.filter((fit: { kq: number }) => Math.abs(fit.kq - 500 / 8.5e-7) < 1)).toHaveLength(1);
    // Exact line I0/I = 1 + 500 [Q] (tests/support/studies.ts): kq = K_SV / tau0 = 500 / 8.5e-7 = 5.88e8 M^-1 s^-1.
    expect(refitted.latestFit.kq).toBeCloseTo(500 / 8.5e-7, -4);
    expect((await api.get(`${base}/studies/${approved.id}`)).body.tau0).toBe(1e-6);
    await shot(page, 'library-lifetime-refitted.png');
  });
});
