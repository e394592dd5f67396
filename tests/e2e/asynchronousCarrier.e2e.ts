/**
 * A fixed carrier that is not a whole multiple of the fundamental (issue 12, capability 5), in the
 * browser: the study form says which whole mf the report needs, and its "Carrier as typed" panel
 * asks the service for the design at the carrier typed and shows p/q, the carrier error and the
 * 1/3 sub-harmonic by its label. Screenshot: tests/e2e/screenshots/asynchronous-carrier.png.
 */
import type { Page } from 'playwright-core';
import type { Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

/** The text box of a labelled field (sliders have a text box beside them). */
const box = (page: Page, label: RegExp) =>
  page.getByLabel(label).and(page.locator('input[type="text"]'));

export const scenarios: Scenario[] = [
  {
    name: 'asynchronous carrier: 70 Hz at 30 Hz is analysed as 7/3 with its 1/3 sub-harmonic',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
      page.setDefaultTimeout(15_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Method').selectOption('sine-triangle');
      await box(page, /^Fundamental frequency/).fill('30');
      await box(page, /^Carrier frequency/).fill('70');
      const carrier = box(page, /^Carrier frequency/);
      const described = (await carrier.getAttribute('aria-describedby')) ?? '';
      const description = (await page.locator(`[id="${described}"]`).textContent()) ?? '';
      assert(
        description.includes('the nearest being mf = 2 (60 Hz)'),
        `the carrier field names the nearest whole mf (got "${description}")`,
      );
      const panel = page.getByRole('region', { name: 'Carrier as typed' });
      await panel.getByRole('button', { name: 'Analyse at this carrier' }).click();
      await panel.getByTestId('async-ratio').getByText('7/3').waitFor();
      const table = panel.getByRole('table', { name: 'Sub-harmonics and largest components' });
      await table.getByRole('cell', { name: '1/3', exact: true }).waitFor();
      await panel.scrollIntoViewIfNeeded();
      await screenshot(page, 'asynchronous-carrier');
      await page.close();
    },
  },
];
