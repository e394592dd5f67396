import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import type { Context, Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

// Issue 17, end to end in the browser: an optimal-pattern sweep job on the harmonic-elimination
// page, and an angle table for a controller chosen from an error target, downloaded as a C header
// that compiles and read back.

async function newPage(context: Context): Promise<Page> {
  const page = await context.browser.newPage({
    viewport: { width: 1400, height: 1000 },
    acceptDownloads: true,
  });
  page.setDefaultTimeout(20_000);
  context.lastPage = page;
  return page;
}

export const scenarios: Scenario[] = [
  {
    name: 'harmonic elimination: an optimal-pattern sweep, then an angle table from an error target as a C header that compiles',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'viewer@kestrel.example');
      await page.getByRole('link', { name: 'Harmonic elimination' }).click();
      await page.getByLabel('Goal').selectOption('optimal');
      await page.getByLabel('Angles per quarter').fill('3');
      await page.getByRole('button', { name: 'Find the optima' }).click();
      await page.getByText(/One family of optima followed/).waitFor({ timeout: 90_000 });
      // One curve per angle, each with its legend entry.
      const legend = page.getByRole('list', { name: 'Legend' }).first().getByRole('listitem');
      assert(
        (await legend.count()) === 3,
        `three angles in the legend (got ${await legend.count()})`,
      );
      await page.locator('svg[data-chart="line"] circle').nth(6).click();
      const angles = page
        .getByRole('table', { name: 'Angles at the picked point' })
        .locator('tbody tr');
      assert(
        (await angles.count()) === 3,
        `three angles at the picked point (got ${await angles.count()})`,
      );
      // The fewest rows whose interpolated angles change the fundamental by at most 0.1 %.
      await page.getByLabel('Rows', { exact: true }).selectOption('target');
      await page.getByLabel('Error measured').selectOption('fundamental-error');
      await page.getByLabel('Target').fill('0.001');
      // The cost model refuses a target search over up to 256 optimal-pattern rows; 32 at most here.
      await page.getByLabel('Most rows').fill('32');
      await page.getByLabel('ma from').nth(1).fill('0.4');
      await page.getByLabel('ma to').nth(1).fill('0.9');
      await page.getByRole('button', { name: 'Build the table' }).click();
      const summary = await page
        .getByTestId('angle-table-summary')
        .textContent({ timeout: 60_000 });
      const rows = Number(/(\d+) rows, ma step/.exec(summary ?? '')?.[1]);
      assert(rows >= 2, `a table of rows (got ${summary})`);
      const [saved] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: 'C header' }).click(),
      ]);
      assert(
        saved.suggestedFilename() === 'angle_table.h',
        `a .h file (got ${saved.suggestedFilename()})`,
      );
      const dir = mkdtempSync(path.join(tmpdir(), 'e2e-angle-table-'));
      try {
        writeFileSync(path.join(dir, 'angle_table.h'), readFileSync(await saved.path(), 'utf8'));
        writeFileSync(
          path.join(dir, 'main.c'),
          '#include <stdio.h>\n#include "angle_table.h"\nint main(void) { printf("%u %u\\n", ANGLE_TABLE_ROWS, ANGLE_TABLE_ANGLES); return 0; }\n',
        );
        execFileSync('cc', [
          '-std=c99',
          '-Wall',
          '-Werror',
          '-o',
          path.join(dir, 'main'),
          path.join(dir, 'main.c'),
        ]);
        const printed = execFileSync(path.join(dir, 'main'), { encoding: 'utf8' }).trim();
        assert(
          printed === `${rows} 3`,
          `the header holds the ${rows} rows of 3 angles the page shows (got ${printed})`,
        );
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
      await screenshot(page, 'elimination-angle-table');
      await page.close();
    },
  },
  {
    name: 'harmonic elimination (issue 13): a staircase of unequal cell sources, and per-cell patterns of a cascaded string',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'viewer@kestrel.example');
      await page.getByRole('link', { name: 'Harmonic elimination' }).click();
      // Eliminating 5 and 7 takes three angles: three cells, each on its own source.
      await page.getByRole('combobox', { name: 'Pattern', exact: true }).selectOption('staircase');
      const sources = page.getByLabel(/Cell sources/);
      await sources.fill('455, 390');
      assert(
        (await sources.getAttribute('aria-invalid')) === 'true',
        'two sources for three angles marked on the field',
      );
      await sources.fill('455, 390, 420');
      await page.getByLabel('ma from').first().fill('0.6');
      await page.getByLabel('ma to').first().fill('0.9');
      await page.getByLabel('Points').fill('8');
      await page.getByRole('button', { name: 'Find the branches' }).click();
      await page.getByText(/One branch followed/).waitFor({ timeout: 90_000 });
      await page.locator('svg[data-chart="line"] circle').nth(2).click();
      const picked = page
        .getByRole('table', { name: 'Angles at the picked point' })
        .locator('tbody tr');
      assert((await picked.count()) === 3, `three angles (got ${await picked.count()})`);
      await page
        .getByText(/Compare events and angle tables take cells of equal sources only/)
        .waitFor();
      await screenshot(page, 'elimination-unequal-sources');

      // Three unipolar cells of two angles each, solved together (the panel's defaults).
      await page.getByRole('button', { name: 'Solve the cells' }).click();
      const cells = page.getByRole('table', { name: 'Angles of each cell' }).locator('tbody tr');
      await cells.first().waitFor({ timeout: 60_000 });
      assert((await cells.count()) === 3, `three cells (got ${await cells.count()})`);
      const status = await page.getByRole('status').first().textContent();
      assert(/^Solved\./.test(status ?? ''), `the string solved (got ${status})`);
      await page.getByText('Spectrum of the string output').waitFor();
      await screenshot(page, 'elimination-cascaded-cells');
      await page.close();
    },
  },
];
