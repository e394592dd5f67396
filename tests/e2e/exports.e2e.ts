import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { parseSpiceNetlist } from '../../packages/modulation/src/netlist/__tests__/spiceNetlist.js';
import type { Context, Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

// Issue 15's downloads, end to end in the browser: the netlist of the controller-tables page,
// a chart's CSV, and a study record exported and imported into another project.

async function newPage(context: Context): Promise<Page> {
  const page = await context.browser.newPage({
    viewport: { width: 1400, height: 900 },
    acceptDownloads: true,
  });
  page.setDefaultTimeout(15_000);
  context.lastPage = page;
  return page;
}

/** Clicks `button` and returns the saved file's name and text. */
async function download(page: Page, click: () => Promise<void>) {
  const [saved] = await Promise.all([page.waitForEvent('download'), click()]);
  return { name: saved.suggestedFilename(), text: readFileSync(await saved.path(), 'utf8') };
}

export const scenarios: Scenario[] = [
  {
    name: "the controller-tables page downloads a SPICE netlist and a chart's CSV with units",
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'viewer@kestrel.example');
      await page.goto(`${context.baseUrl}/controller-tables`);
      await page.getByLabel(/Fundamental periods/).fill('2');
      const netlist = await download(page, () =>
        page.getByRole('button', { name: 'SPICE netlist' }).click(),
      );
      assert(netlist.name.endsWith('.cir'), `a .cir file (got ${netlist.name})`);
      // Read back by the reader written from the SPICE user's guides: two gates and a leg voltage
      // for each leg, over two periods of the page's 50 Hz fundamental.
      const parsed = parseSpiceNetlist(netlist.text);
      const names = parsed.sources.map((s) => s.name);
      assert(
        names.includes('Vgate_a_high') && names.includes('Vgate_a_low') && names.includes('Vleg_a'),
        `gate and leg sources (got ${names.join(' ')})`,
      );
      const tran = parsed.controls.find((c) => c[0] === '.tran');
      assert(tran?.[2] === '4e-2', `.tran over two 50 Hz periods (got ${tran?.join(' ')})`);
      await page.getByLabel(/Rise time/).fill('60000');
      await page.getByRole('button', { name: 'SPICE netlist' }).click();
      await page.getByText(/riseTime must be shorter than the shortest time/).waitFor();
      await screenshot(page, 'controller-tables-netlist');
      const csv = await download(page, () =>
        page
          .getByRole('button', { name: /data as CSV/ })
          .first()
          .click(),
      );
      const header = csv.text.split('\n')[0] ?? '';
      assert(csv.name.endsWith('.csv'), `a .csv file (got ${csv.name})`);
      assert(/^order,label,.*\(V peak\)/.test(header), `units in the header (got ${header})`);
      await page.close();
    },
  },
  {
    name: 'a study exported as a record and imported into another project has the same design',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page
        .getByRole('link', { name: /Bench prototype/ })
        .first()
        .click();
      const record = await download(page, () =>
        page.getByRole('button', { name: 'Export record' }).click(),
      );
      const exported = JSON.parse(record.text) as { name: string; design: unknown };
      assert(record.name.endsWith('.study.json'), `a .study.json file (got ${record.name})`);
      await page.goto(`${context.baseUrl}/studies`);
      await page.getByRole('button', { name: /7\.5 kW drive/ }).click();
      const [chooser] = await Promise.all([
        page.waitForEvent('filechooser'),
        page.getByText('Import record').click(),
      ]);
      await chooser.setFiles({
        name: record.name,
        mimeType: 'application/json',
        buffer: Buffer.from(record.text),
      });
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      await page.getByRole('heading', { name: exported.name }).waitFor();
      const copy = await download(page, () =>
        page.getByRole('button', { name: 'Export record' }).click(),
      );
      const again = JSON.parse(copy.text) as { design: unknown };
      assert(
        JSON.stringify(again.design) === JSON.stringify(exported.design),
        'the imported study exports the same design',
      );
      await screenshot(page, 'imported-study');
      await page.close();
    },
  },
];
