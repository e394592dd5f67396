import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import type { Context, Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

// Issue 12, timer tables for the reduced common-mode methods (A. M. Hava and E. Ün, IEEE Trans.
// Power Electronics, 2009): the controller-tables page makes an AZSPWM1 table, shows each entry's
// compare sense, and downloads a CSV and a C header that carry it.

async function newPage(context: Context): Promise<Page> {
  const page = await context.browser.newPage({
    viewport: { width: 1400, height: 900 },
    acceptDownloads: true,
  });
  page.setDefaultTimeout(15_000);
  context.lastPage = page;
  return page;
}

async function download(page: Page, click: () => Promise<void>) {
  const [saved] = await Promise.all([page.waitForEvent('download'), click()]);
  return { name: saved.suggestedFilename(), text: readFileSync(await saved.path(), 'utf8') };
}

export const scenarios: Scenario[] = [
  {
    name: 'the controller-tables page makes an AZSPWM1 table with its compare senses and downloads them',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'viewer@kestrel.example');
      await page.goto(`${context.baseUrl}/controller-tables`);
      await page.getByLabel('Inverter').selectOption('three-phase');
      await page.getByLabel('Zero sequence').selectOption('azspwm1');
      await page.getByTestId('compare-sense-note').waitFor();
      const header = await page.getByRole('columnheader', { name: /^a: duty \/ sense/ }).count();
      assert(header === 1, 'a sense column for channel a');
      const above = await page.locator('td strong', { hasText: 'above' }).count();
      assert(above > 0, `entries of sense above in the table (got ${above})`);
      await screenshot(page, 'controller-tables-azspwm1');
      const csv = await download(page, () =>
        page.getByRole('button', { name: 'CSV', exact: true }).click(),
      );
      const columns = csv.text.split('\r\n')[0]?.split(',') ?? [];
      assert(columns.includes('b_sense'), `a b_sense column (got ${columns.join(',')})`);
      const rows = csv.text.trimEnd().split('\r\n').slice(1);
      const senses = rows.map((row) => {
        const cells = row.split(',');
        return ['a', 'b', 'c'].map((ch) => cells[columns.indexOf(`${ch}_sense`)]);
      });
      // One phase, the middle one, is above in every entry.
      assert(
        senses.every((s) => s.filter((x) => x === 'above').length === 1),
        'exactly one channel above per entry',
      );
      const cHeader = await download(page, () =>
        page.getByRole('button', { name: 'C header', exact: true }).click(),
      );
      assert(/static const uint8_t \w+_a_above\[/.test(cHeader.text), 'the _above arrays');
      // Edge-aligned counting cannot run it: the library's words on the counting-mode field.
      await page.getByLabel('Counting mode').selectOption('edge-aligned');
      await page
        .getByText(/Counting mode must be 'centre-aligned' for zeroSequence 'azspwm1'/)
        .waitFor();
      await page.close();
    },
  },
];
