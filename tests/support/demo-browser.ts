import fs from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { Lab } from '../../server/models';
import { demoLabs, demoPassword, demoPeople, seedDemoData } from '../../server/seed/demo';
import { launchBrowser, screenshotDir, signInThroughPage } from './browser';
import { startLiveServer } from './live-server';

export interface DemoInBrowser {
  server: Awaited<ReturnType<typeof startLiveServer>>;
  browser: Browser;
  page: Page;
  labId: string;
  close(): Promise<void>;
}

/**
 * What the browser tests on the demo data start with: a live server holding the demo, Chromium,
 * and one page signed in as the demo researcher, with the first demo lab's id for the URLs.
 * `close` stops the browser and the server (call it from afterAll).
 */
export async function openDemoAsResearcher(viewport: { width: number; height: number }): Promise<DemoInBrowser> {
  const server = await startLiveServer();
  await seedDemoData(server.sequelize);
  const labId = (await Lab.findOne({ where: { slug: demoLabs[0].slug } }))!.id;
  const browser = await launchBrowser();
  const page = await browser.newPage({ viewport });
  fs.mkdirSync(screenshotDir, { recursive: true });
  await signInThroughPage(page, server.baseUrl, { email: demoPeople[0]!.email, password: demoPassword });
  const close = async () => {
    await browser.close();
    await server.stop();
  };
  return { server, browser, page, labId, close };
}
