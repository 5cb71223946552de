import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { describeFirstLoad, firstLoadBudgets, measureFirstLoad } from '../support/first-load';

const distDir = path.resolve('dist/client');

/*
 * The JavaScript a screen needs before it draws stays within its budget (brotli, what the server
 * sends to browsers that ask for it). Sizes come from the build manifest, so this is no timing test.
 */
describe('first-load budgets of the built client', () => {
  for (const budget of firstLoadBudgets) {
    it(`when the ${budget.screen} screen is opened first, then its JavaScript stays within ${budget.brotliBudget / 1000} kB brotli`, () => {
      const load = measureFirstLoad(distDir, budget);
      process.stdout.write(`${describeFirstLoad(load, budget)}\n`);
      expect(load.js.brotli).toBeLessThanOrEqual(budget.brotliBudget);
    });
  }

  it('when the sign-in screen is opened first, then neither the chart library nor the schema library comes with it', () => {
    const contains = (files: string[], marker: string) =>
      files.some((file) => file.endsWith('.js') && fs.readFileSync(path.join(distDir, file), 'utf8').includes(marker));
    // Strings that survive minification: chart.js's date-adapter message and zod's error class.
    const chartMarker = 'complete date adapter';
    const schemaMarker = 'ZodError';
    const signIn = measureFirstLoad(distDir, firstLoadBudgets[0]!).files;
    const study = measureFirstLoad(distDir, firstLoadBudgets[1]!).files;
    expect(contains(study, chartMarker)).toBe(true);
    expect(contains(study, schemaMarker)).toBe(true);
    expect(contains(signIn, chartMarker)).toBe(false);
    expect(contains(signIn, schemaMarker)).toBe(false);
  });
});
