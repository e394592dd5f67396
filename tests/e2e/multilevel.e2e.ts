/**
 * Multilevel bridges in the study editor (issue 13): an engineer picks the multilevel carrier
 * method, a three-phase three-level NPC bridge with PD carriers, sees the level-by-level chart
 * (three legs on their three levels), the bridge's device switching frequencies and the
 * neutral-point current panel, offers only the arrangements each topology accepts, saves the study
 * and reads the server's report. Screenshots in tests/e2e/screenshots/: multilevel-npc.png (the
 * page), multilevel-levels.png (the level chart), multilevel-figures.png (the bridge's figures) and
 * multilevel-losses.png (with an IGBT, the losses by device position and class).
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import type { Scenario } from './dashboard.e2e.js';
import { assert, screenshot, screenshotDir, signIn } from './harness.js';

/** The values of a select's options, in order. */
const optionValues = (page: Page, label: string) =>
  page
    .getByLabel(label, { exact: true })
    .locator('option')
    .evaluateAll((options) => options.map((o) => o.getAttribute('value')));

export const scenarios: Scenario[] = [
  {
    name: 'multilevel: a three-phase NPC PD study shows its levels, device frequencies and neutral-point current',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
      page.setDefaultTimeout(15_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Name', { exact: true }).fill('Three-level NPC drive');
      await page.getByLabel('Method').selectOption('multilevel-carrier');

      // The arrangements follow the topology (the library's MULTILEVEL_CARRIERS_BY_TOPOLOGY).
      await page.getByLabel('Topology').selectOption('flying-capacitor');
      const flying = await optionValues(page, 'Carriers');
      assert(
        flying.join() === 'phase-shifted',
        `flying capacitor offers phase-shifted only (got ${flying.join()})`,
      );
      await page.getByLabel('Topology').selectOption('npc');
      const npc = await optionValues(page, 'Carriers');
      assert(npc.join() === 'pd,pod,apod', `NPC offers PD, POD, APOD (got ${npc.join()})`);
      await page.getByLabel('Carriers').selectOption('pd');

      const levels = page.getByRole('figure', { name: /^Levels, .*NPC.*, 3 levels$/ });
      await levels.waitFor();
      const rows = await levels
        .locator('[data-row]')
        .evaluateAll((gs) => gs.map((g) => g.getAttribute('data-row')));
      assert(rows.join() === 'leg a,leg b,leg c', `three legs drawn (got ${rows.join()})`);
      // PD: levels − 1 = 2 carriers in bands over the reference (McGrath and Holmes 2002).
      const modulator = page.getByRole('figure', { name: 'Modulator and bridge voltage' });
      const carriers = await modulator.locator('[data-carrier]').count();
      assert(carriers === 2, `the modulator draws the two PD carriers (got ${carriers})`);
      await modulator.screenshot({ path: path.join(screenshotDir, 'multilevel-modulator.png') });
      const devices = page.getByRole('table', { name: 'Device switching frequencies' });
      await devices.getByRole('cell', { name: 'S1', exact: true }).waitFor();
      const neutral = page.getByRole('figure', { name: /Neutral-point current/ });
      await neutral.waitFor();
      await page
        .getByRole('table', { name: 'Neutral-point figures' })
        .getByText('Low-frequency ripple', { exact: false })
        .waitFor();

      // With an IGBT the bridge's losses by position: S1…S4, D5, D6 of each of the three legs.
      await page.getByLabel('Device for the losses').selectOption('igbt');
      const losses = page.getByRole('figure', { name: 'Losses by device position (NPC)' });
      await losses.waitFor();
      const positions = await losses.locator('g[data-bar]').count();
      assert(positions === 18, `a bar for each of the 18 positions (got ${positions})`);
      const classes = await page
        .getByRole('table', { name: 'Losses by device class' })
        .locator('tr[data-class]')
        .evaluateAll((rows) => rows.map((r) => r.getAttribute('data-class')));
      assert(
        classes.join() === 'outer switch,inner switch,clamp diode',
        `the NPC device classes (got ${classes.join()})`,
      );
      await page
        .getByRole('region', { name: 'Multilevel losses' })
        .screenshot({ path: path.join(screenshotDir, 'multilevel-losses.png') });

      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      await levels.scrollIntoViewIfNeeded();
      await screenshot(page, 'multilevel-npc');
      await levels.screenshot({ path: path.join(screenshotDir, 'multilevel-levels.png') });
      await page
        .getByRole('region', { name: 'Multilevel bridge' })
        .screenshot({ path: path.join(screenshotDir, 'multilevel-figures.png') });

      // Compare: the NPC study beside a two-level three-phase study of the demo, named by its bridge.
      const npcId = page.url().split('/').pop() ?? '';
      const token = await page.evaluate<string | null>(
        'sessionStorage.getItem("pulsewright.session")',
      );
      const answer = await page.request.get(`${context.baseUrl}/api/v1/studies`, {
        headers: { authorization: `Bearer ${token ?? ''}` },
      });
      const studies = (await answer.json()) as { id: string; method: string }[];
      const twoLevel = studies.find(
        (s) => s.method === 'three-phase' || s.method === 'space-vector',
      );
      assert(twoLevel, 'the demo holds a two-level three-phase study');
      await page.goto(`${context.baseUrl}/compare?ids=${npcId},${twoLevel.id}`);
      await page
        .getByRole('cell', { name: /Three-level neutral-point-clamped \(NPC\), 3 levels/ })
        .first()
        .waitFor();
      await page.getByText('Analysing the designs…').waitFor({ state: 'hidden' });
      await screenshot(page, 'multilevel-compare');
      await page.close();
    },
  },
  {
    name: 'multilevel: a five-level flying-capacitor leg stacks its cells and shows each capacitor charge',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
      page.setDefaultTimeout(15_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Method').selectOption('multilevel-carrier');
      await page.getByLabel('Topology').selectOption('flying-capacitor');
      await page.getByLabel('Levels', { exact: true }).fill('5');
      const levels = page.getByRole('figure', { name: /^Levels, Flying capacitor, 5 levels$/ });
      await levels.waitFor();
      const rows = await levels
        .locator('[data-row]')
        .evaluateAll((gs) => gs.map((g) => g.getAttribute('data-row')));
      // Four commutation cells (levels − 1) under the three legs, cell 1 (outermost) first.
      assert(
        rows.join() ===
          'leg a,leg b,leg c,leg a, cell 1 upper switch,leg a, cell 2 upper switch,leg a, cell 3 upper switch,leg a, cell 4 upper switch',
        `legs and cells drawn (got ${rows.join()})`,
      );
      const charge = page.getByRole('figure', {
        name: /Flying-capacitor charge per carrier period/,
      });
      await charge.waitFor();
      await levels.screenshot({ path: path.join(screenshotDir, 'multilevel-flying-levels.png') });
      await charge.screenshot({ path: path.join(screenshotDir, 'multilevel-flying-charge.png') });
      await page.close();
    },
  },
  {
    name: 'multilevel: the three-level space-vector diagram shows the 19 points, the reference and the applied states',
    async run(context) {
      const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
      page.setDefaultTimeout(15_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Method').selectOption('multilevel-space-vector');
      await page.getByLabel('Topology').selectOption('t-type');
      const diagram = page.getByRole('figure', { name: 'Three-level vector diagram' });
      await diagram.waitFor();
      // 27 states on 19 points: zero, six small, six medium, six large (Celanovic and Boroyevich 2000).
      const points = await diagram.locator('[data-kind]').count();
      assert(points === 19, `19 points drawn (got ${points})`);
      await diagram.getByLabel('Switching period shown').fill('5');
      const text = (await diagram.getByTestId('vector-period').textContent()) ?? '';
      assert(
        /sector \d, region \d/.test(text),
        `the chosen period names its sector and region (${text})`,
      );
      const lit = await diagram.locator('[data-applied]').count();
      assert(
        lit >= 3 && lit <= 4,
        `the period's nearest three vectors are marked (got ${lit} points)`,
      );
      const neutral = page.getByRole('figure', { name: /Neutral-point current/ });
      await neutral.waitFor();
      await diagram.screenshot({ path: path.join(screenshotDir, 'multilevel-vector-diagram.png') });
      await page.close();
    },
  },
];
