import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import { chromium } from 'playwright-core';
import type { Browser, Page } from 'playwright-core';

const chromiumPath = '/usr/bin/chromium';

/** Debian's Chromium, installed with apt when missing and we are root; never a downloaded browser. */
function ensureChromium(): void {
  if (fs.existsSync(chromiumPath)) return;
  if (process.getuid?.() !== 0) {
    throw new Error(`Chromium is missing. Install it with: sudo apt-get install -y chromium`);
  }
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

export async function launchBrowser(): Promise<Browser> {
  ensureChromium();
  return chromium.launch({
    executablePath: chromiumPath,
    // Flags that keep Chromium off the network entirely (this machine reaches only package registries).
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
}

export const screenshotDir = 'test-output/e2e';

/** Signs in through the real sign-in screen, as a person would, and waits for the overview. */
export async function signInThroughPage(page: Page, baseUrl: string, person: { email: string; password: string }) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(person.email);
  await page.getByLabel('Password').fill(person.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Overview', level: 1 }).waitFor();
}

/**
 * From any signed-in screen: Studies, New study, two new compounds typed in, Create; waits for
 * the new study's heading.
 */
export async function createStudyThroughPage(page: Page, study: { emitter: string; quencher: string; title: string }) {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Studies' }).click();
  await page.getByRole('link', { name: 'New study' }).click();
  await page.getByLabel('Emitter (required)').selectOption({ label: '+ a new compound…' });
  await page.getByLabel('New emitter name').fill(study.emitter);
  await page.getByLabel('Quencher (required)').selectOption({ label: '+ a new compound…' });
  await page.getByLabel('New quencher name').fill(study.quencher);
  await page.getByLabel('Title').fill(study.title);
  await page.getByRole('button', { name: 'Create study' }).click();
  await page.getByRole('heading', { name: study.title, level: 1 }).waitFor();
}
