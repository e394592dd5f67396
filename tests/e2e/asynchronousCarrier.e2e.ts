/**
 * A fixed carrier that is not a whole multiple of the fundamental (issue 12, capability 5), in the
 * browser. The design report takes it for sine-triangle, three-phase carrier and space vector:
 * the study form states p/q and the span, the editor's report says what it covers, a saved study
 * shows its ratio in Compare and in the printed report. With a filter or a grid the report spans
 * it too (issue 12 items 5-6: a grid-tied design at 60 Hz with a 10 kHz carrier, 500/3); where
 * the filter's span costs too much the carrier field says so and the "Carrier as typed" panel
 * gives the spectra at the carrier typed.
 * Screenshots: tests/e2e/screenshots/asynchronous-carrier.png, fixed-carrier-editor.png,
 * fixed-carrier-compare.png, fixed-carrier-report.png, grid-span-editor.png, grid-span-groups.png,
 * grid-span-compare.png, grid-span-report.png.
 */
import type { Page } from 'playwright-core';
import type { Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

/** The text box of a labelled field (sliders have a text box beside them). */
const box = (page: Page, label: RegExp) =>
  page.getByLabel(label).and(page.locator('input[type="text"]'));

/** The text that describes a field (its hint or its message). */
const descriptionOf = async (page: Page, label: RegExp): Promise<string> => {
  const described = (await box(page, label).getAttribute('aria-describedby')) ?? '';
  return (await page.locator(`[id="${described}"]`).textContent()) ?? '';
};

/**
 * Opens Compare with the saved study beside another study of the account and checks that the
 * study's mf column reads the carrier span's ratio p/q.
 */
async function compareShowsRatio(
  page: Page,
  baseUrl: string,
  study: { id: string; name: string },
  expected: string,
): Promise<void> {
  const session = await page.evaluate<string | null>(
    'sessionStorage.getItem("pulsewright.session")',
  );
  const listed = (await (
    await fetch(`${baseUrl}/api/v1/studies`, { headers: { Authorization: `Bearer ${session}` } })
  ).json()) as { id: string; name: string }[];
  const other = listed.find((s) => s.id !== study.id);
  assert(other, 'a second study to compare with');
  await page.goto(`${baseUrl}/compare?ids=${study.id},${other.id}`);
  const mf = page.locator(`tr[data-study="${study.name}"] [data-column="mf"]`);
  await mf.waitFor();
  const ratio = (await mf.textContent())?.trim();
  assert(ratio === expected, `Compare shows mf ${expected} (got ${ratio})`);
}

export const scenarios: Scenario[] = [
  {
    name: 'asynchronous carrier: 70 Hz at 30 Hz is reported as 7/3 over three periods, with a filter too; a costly filtered span goes to the panel',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
      page.setDefaultTimeout(15_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Method').selectOption('sine-triangle');
      await box(page, /^Fundamental frequency/).fill('30');
      await box(page, /^Carrier frequency/).fill('70');
      await page
        .getByTestId('carrier-span')
        .getByText(/mf = 7\/3/)
        .waitFor();
      const hint = await descriptionOf(page, /^Carrier frequency/);
      assert(
        hint.includes('mf = 7/3') && hint.includes('3 fundamental periods'),
        `the carrier field states p/q and the span (got "${hint}")`,
      );
      await page.getByText('Modulator and bridge voltage over 3 fundamental periods').waitFor();
      // With a filter the report spans it too: the filter's output over the three periods.
      await page.getByLabel('Include an LC output filter').check();
      await page.getByText('Modulator and bridge voltage over 3 fundamental periods').waitFor();
      const filtered = await descriptionOf(page, /^Carrier frequency/);
      assert(
        filtered.includes('mf = 7/3'),
        `with a filter the carrier field still states p/q (got "${filtered}")`,
      );
      // 3000 Hz at 37 Hz through the filter (821 orders over 37 periods) costs too much: the
      // library's words on the carrier field, and the panel analyses the carrier as typed.
      await box(page, /^Fundamental frequency/).fill('37');
      await box(page, /^Carrier frequency/).fill('3000');
      const panel = page.getByRole('region', { name: 'Carrier as typed' });
      await panel.getByRole('button', { name: 'Analyse at this carrier' }).click();
      await panel.getByTestId('async-ratio').getByText('3000/37').waitFor();
      const refused = await descriptionOf(page, /^Carrier frequency/);
      assert(
        refused.includes('or for a design with a filter a ratio p/q'),
        `the carrier field gives the library's refusal (got "${refused}")`,
      );
      await panel.scrollIntoViewIfNeeded();
      await screenshot(page, 'asynchronous-carrier');
      await page.close();
    },
  },
  {
    name: 'a drive with a fixed 4 kHz carrier at 37 Hz: saved, reported over 37 periods, compared and printed with mf 4000/37',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 1000 } });
      page.setDefaultTimeout(60_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      const name = `E2E fixed carrier 37 Hz ${Date.now()}`;
      await page.getByLabel('Name', { exact: true }).fill(name);
      await page.getByLabel('Method').selectOption('three-phase');
      await box(page, /^Fundamental frequency/).fill('37');
      await box(page, /^Carrier frequency/).fill('4000');
      await page.getByLabel('Inductance L').fill('10');
      const note = page.getByTestId('carrier-span');
      await note.getByText(/mf = 4000\/37/).waitFor();
      const text = (await note.textContent()) ?? '';
      assert(
        text.includes('37 fundamental periods (4000 carrier cycles)'),
        `the report states its span (got "${text}")`,
      );
      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      const id = page.url().split('/').pop() ?? '';
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      // A bar for every component n/37 (most of them near zero height).
      await page.locator('svg[data-chart="spectrum"]').waitFor();
      const bars = await page.locator('svg[data-chart="spectrum"] rect[data-bar]').count();
      assert(bars >= 37 * 119, `the spectrum draws every n/37 component (got ${bars} bars)`);
      const serverLine = (await page.getByTestId('preview-time').textContent()) ?? '';
      assert(
        serverLine.includes('Saved revision on the server: THD'),
        `the server's report of the saved study is shown (got "${serverLine}")`,
      );
      await screenshot(page, 'fixed-carrier-editor');

      await compareShowsRatio(page, context.baseUrl, { id, name }, '4000/37');
      await screenshot(page, 'fixed-carrier-compare');

      await page.goto(`${context.baseUrl}/studies/${id}/report`);
      await page.getByText('Pulsewright study report').waitFor();
      await page.getByTestId('carrier-span').waitFor();
      await page
        .getByText(/mf 4000\/37 ≈ 108\.108/)
        .first()
        .waitFor();
      await screenshot(page, 'fixed-carrier-report');
      await page.close();
    },
  },
  {
    name: 'a grid-tied design at 60 Hz with a 10 kHz carrier: saved, reported over 3 periods through its LCL, limits on harmonic groups, compared and printed with mf 500/3',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 1000 } });
      page.setDefaultTimeout(60_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      const name = `E2E grid 60 Hz at 10 kHz ${Date.now()}`;
      await page.getByLabel('Name', { exact: true }).fill(name);
      await page.getByLabel('Method').selectOption('three-phase');
      await box(page, /^DC bus/).fill('700');
      await box(page, /^Fundamental frequency/).fill('60');
      await box(page, /^Carrier frequency/).fill('10000');
      await page.getByLabel('Include an LC output filter').check();
      await box(page, /^Filter C/).fill('10');
      await box(page, /^Damping R/).fill('2');
      await page.getByLabel(/Feed a grid instead of the load/).check();
      await box(page, /^Grid voltage/).fill('400');
      const note = page.getByTestId('carrier-span');
      await note.getByText(/mf = 500\/3/).waitFor();
      const text = (await note.textContent()) ?? '';
      assert(
        text.includes('3 fundamental periods (500 carrier cycles)'),
        `the report states its span (got "${text}")`,
      );
      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      const id = page.url().split('/').pop() ?? '';
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      const verdict = (await page.getByTestId('grid-verdict').textContent()) ?? '';
      assert(verdict.includes('IEEE Std 519'), `the grid verdict is shown (got "${verdict}")`);
      // The resonance card is the LCL's, (1/2π)·√((L1 + L2')/(L1·L2'·C)) = 2210 Hz with
      // L2' = 0.7 mH (Liserre, Blaabjerg and Hansen, 2005), 10 kHz/2210 Hz = 4.524 from the
      // carrier (hand-worked), not L1 with C's 1125 Hz; and the grid panel says why IEEE 519's
      // < 20 row applies although I_SC/I_L is about 80 (generation footnote, from memory).
      const card = page.locator('[data-figure="LCL resonance"]').first().locator('..');
      const cardText = (await card.textContent()) ?? '';
      assert(
        cardText.includes('2210 Hz') && cardText.includes('carrier 4.524× above it'),
        `the LCL resonance card with its distance from the carrier (got "${cardText}")`,
      );
      const reason = (await page.getByTestId('grid-row-reason').textContent()) ?? '';
      assert(
        reason.includes('The I_SC/I_L < 20 row is used although I_SC/I_L is 80'),
        `the grid panel says why the < 20 row is used (got "${reason}")`,
      );
      // A bridge that draws power (the grid fieldset's box cleared: grid.generation false) is
      // read on the row of its own ratio, 50 < I_SC/I_L < 100 at about 80 (IEEE Std 519-2022
      // Table 2, from memory), and the footnote's sentence goes; ticked again, both come back.
      const generating = page.getByLabel(/The bridge delivers power to the grid/);
      await generating.uncheck();
      await page.getByTestId('grid-verdict').getByText('(50 < I_SC/I_L < 100)').waitFor();
      assert(
        (await page.getByTestId('grid-row-reason').count()) === 0,
        'no footnote sentence for a bridge that draws power',
      );
      await generating.check();
      await page.getByTestId('grid-row-reason').waitFor();
      await page.getByText('Modulator and bridge voltage over 3 fundamental periods').waitFor();
      await screenshot(page, 'grid-span-editor');
      const grouping = page.getByTestId('grid-grouping');
      await grouping.locator('summary').click();
      const groups = grouping.getByRole('table', { name: 'Harmonic groups' });
      await groups.waitFor();
      const rows = await groups.locator('tbody tr').count();
      assert(rows === 50, `groups 1 to 50 are listed (got ${rows})`);
      const fifth = (await groups.locator('tbody tr').nth(4).textContent()) ?? '';
      assert(
        fifth.includes('4.667') && fifth.includes('5.333'),
        `group 5 took the components at 14/3 and 16/3 (got "${fifth}")`,
      );
      const summary = (await grouping.locator('summary').textContent()) ?? '';
      assert(
        summary.includes('IEC 61000-4-7, from memory; confirm with the standard and the utility'),
        `the grouping names its rule's source and the caution (got "${summary}")`,
      );
      await grouping.scrollIntoViewIfNeeded();
      await screenshot(page, 'grid-span-groups');

      await compareShowsRatio(page, context.baseUrl, { id, name }, '500/3');
      await screenshot(page, 'grid-span-compare');

      await page.goto(`${context.baseUrl}/studies/${id}/report`);
      await page.getByText('Pulsewright study report').waitFor();
      await page.getByTestId('carrier-span').waitFor();
      await page
        .getByText(/mf 500\/3 ≈ 166\.667/)
        .first()
        .waitFor();
      await page.getByTestId('grid-verdict').waitFor();
      // The design table reads the grid design as one: its grid and LCL, not "Load: none", and
      // once the report is in, each standard's verdict on the grid current.
      const designTable = page.getByRole('table', { name: 'Design' });
      await designTable.getByText(/^IEEE Std 1547-2018 /).waitFor();
      const designText = (await designTable.textContent()) ?? '';
      assert(
        designText.includes('400 V rms line to line, 60 Hz') &&
          designText.includes('L1 2 mH, C 10 µF, L2 0.5 mH') &&
          designText.includes('LCL resonance 2210 Hz (carrier 4.524× above it)') &&
          designText.includes('The I_SC/I_L < 20 row is used although I_SC/I_L is 80') &&
          !/Load/.test(designText),
        `the printed design table shows the grid and its LCL, no load (got "${designText.slice(0, 400)}")`,
      );
      await screenshot(page, 'grid-span-report');
      await page.close();
    },
  },
];
