import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { assert, screenshot, signIn } from './harness.js';
import { waitForDeliveredMail } from '../support/server.js';

export interface Context {
  browser: Browser;
  baseUrl: string;
  /** Shared between scenarios, in order: the study the engineer created. */
  state: { studyId?: string };
  /** The page a scenario opened last (screenshotted when the scenario fails). */
  lastPage?: Page;
}

export interface Scenario {
  name: string;
  run(context: Context): Promise<void>;
}

async function newPage(context: Context): Promise<Page> {
  const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
  page.setDefaultTimeout(15_000);
  context.lastPage = page;
  return page;
}

async function token(page: Page): Promise<string> {
  const value = await page.evaluate<string | null>('sessionStorage.getItem("pulsewright.session")');
  assert(value, 'the session token is kept in sessionStorage');
  return value;
}

const ROLES = [
  { email: 'admin@kestrel.example', role: 'admin' },
  { email: 'engineer@kestrel.example', role: 'engineer' },
  { email: 'viewer@kestrel.example', role: 'viewer' },
] as const;

export const scenarios: Scenario[] = [
  {
    name: 'each demo role signs in, sees its role and the caution, and signs out',
    async run(context) {
      for (const { email, role } of ROLES) {
        const page = await newPage(context);
        await signIn(page, context.baseUrl, email);
        const shown = (await page.getByTestId('role').textContent())?.trim();
        assert(shown === role, `role badge shows ${role} (got ${shown})`);
        assert(
          await page.getByRole('complementary', { name: 'Safety caution' }).isVisible(),
          'the hazard caution is visible',
        );
        assert(
          (await page.getByRole('link', { name: 'Team' }).count()) === (role === 'viewer' ? 0 : 1),
          'Team link only for engineers and admins',
        );
        await page.getByRole('heading', { name: 'Studies', exact: true }).waitFor();
        await page
          .getByRole('link', { name: /Bench prototype/ })
          .first()
          .waitFor();
        await screenshot(page, `studies-${role}`);
        await page.getByRole('button', { name: 'Sign out' }).click();
        await page.getByRole('button', { name: 'Sign in' }).waitFor();
        await page.close();
      }
    },
  },
  {
    name: 'a wrong password shows the server message on the sign-in form',
    async run(context) {
      const page = await newPage(context);
      await page.goto(`${context.baseUrl}/sign-in`);
      await page.getByLabel('E-mail').fill('engineer@kestrel.example');
      await page.getByLabel('Password').fill('not-the-password');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('alert').first().waitFor();
      await screenshot(page, 'sign-in-error');
      await page.close();
    },
  },
  {
    name: 'an engineer creates a project and a study and sees its spectrum render',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      const projectName = `Pump inverter e2e ${Date.now()}`;
      await page.getByLabel('Project name').fill(projectName);
      await page.getByRole('button', { name: 'Create project' }).click();
      await page.getByRole('button', { name: `${projectName} (0)`, pressed: true }).waitFor();
      await page.getByRole('link', { name: 'New study' }).click();
      await page.getByLabel('Name', { exact: true }).fill('E2E unipolar mf 31');
      const chosen = await page
        .getByLabel('Project')
        .evaluate(
          (el) =>
            (el as unknown as { selectedOptions: { text: string }[] }).selectedOptions[0]?.text,
        );
      assert(
        chosen === projectName,
        `the new study goes into the project just made (got ${chosen})`,
      );
      await page.getByLabel('Bridge scheme').selectOption('unipolar');
      const mf = page.getByLabel('Frequency ratio mf', { exact: true });
      await mf.fill('31');
      await mf.press('Enter');
      const bars = page.locator('svg[data-chart="spectrum"] rect[data-bar]');
      await bars.first().waitFor();
      assert((await bars.count()) > 50, 'the live spectrum draws one bar per harmonic');
      await screenshot(page, 'study-new');
      // The live preview's cost at mf = 101, as the editor measures it in this browser, after
      // two warm-up changes (the first calls of a freshly loaded chunk include compilation).
      for (const value of ['101', '99', '101']) {
        await mf.fill(value);
        await mf.press('Enter');
        await page.getByText(`Spectrum to order ${3 * Number(value) + 20}`).waitFor();
      }
      const timing = (await page.getByTestId('preview-time').textContent()) ?? '';
      const ms = Number(/([\d.]+) ms/.exec(timing)?.[1]);
      console.log(`    live preview at mf = 101 in chromium: ${ms} ms`);
      // Goal one 16 ms frame; the check leaves room for a loaded CI machine and catches gross regressions.
      assert(Number.isFinite(ms) && ms < 100, `preview at mf = 101 takes ${ms} ms`);
      await mf.fill('31');
      await mf.press('Enter');
      await page.getByText('Spectrum to order 113').waitFor();
      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      context.state.studyId = page.url().split('/').pop();
      await page.getByText('Revision 1', { exact: false }).first().waitFor();
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      // The saved study's page draws its chart again when the server's report arrives: wait for
      // the labels of that drawing rather than read them in between (CI once read none there).
      const labelTexts = page.locator('svg[data-chart="spectrum"] [data-labels] text');
      await labelTexts
        .first()
        .waitFor({ timeout: 10_000 })
        .catch(() => undefined);
      const labels = await labelTexts.allTextContents();
      assert(
        labels.some((l) => l.startsWith('2mf')),
        `unipolar spectrum labels the 2mf group (labels: ${labels.join(' ')})`,
      );
      await screenshot(page, 'study-editor');
      await page.close();
    },
  },
  {
    name: 'an engineer duplicates a study, saves a revision, restores the first, and prints the report',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page
        .getByRole('link', { name: 'Bench prototype (42 × 50 Hz carrier)', exact: true })
        .click();
      await page.getByRole('link', { name: 'Printable report' }).waitFor();
      await page.getByRole('button', { name: 'Duplicate', exact: true }).click();
      await page.getByRole('heading', { name: /\(copy\)$/ }).waitFor();
      const id = page.url().split('/').pop();
      assert(id && /^[0-9a-f-]{36}$/.test(id), 'the copy opens at its own URL');
      context.state.studyId ??= id;
      const ma = page.getByLabel('Modulation index ma', { exact: true });
      await ma.fill('0.6');
      await ma.press('Enter');
      await page.getByRole('button', { name: 'Save revision' }).click();
      await page.getByText('Saved as revision 2').waitFor();
      await page.goto(`${context.baseUrl}/studies/${id}/report`);
      await page.getByText('Pulsewright study report').waitFor();
      await page.locator('svg[data-chart="spectrum"]').waitFor();
      await page.getByText(/Revision 2 by engineer@kestrel.example/).waitFor();
      await screenshot(page, 'study-report');
      await page.goBack();
      const history = page.getByRole('list', { name: 'Revisions' });
      await history.getByText('Revision 1').waitFor();
      await history.getByRole('button', { name: 'Restore' }).click();
      await page.getByText('Revision 3 · sine-triangle').waitFor();
      await history.getByText('restored from 1').waitFor();
      const restoredMa = await page.getByLabel('Modulation index ma', { exact: true }).inputValue();
      assert(restoredMa === '0.8', `restoring revision 1 brings its ma back (got ${restoredMa})`);
      await screenshot(page, 'study-revisions');
      await page.close();
    },
  },
  {
    name: 'a design with a filter and a load: the same exact THD in the editor, Compare and the printed report; the limit check follows the filter',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      const name = `E2E filtered 10 kHz ${Date.now()}`;
      await page.getByLabel('Name', { exact: true }).fill(name);
      // Bipolar, ma 0.9, 400 V, 50 Hz, carrier 10.05 kHz (mf 201); load 10 Ω + 2 mH (invented values).
      await page.getByLabel('Modulation index ma', { exact: true }).fill('0.9');
      await page.getByLabel('Carrier frequency').fill('10050');
      await page.getByText('mf = 201').waitFor();
      await page.getByLabel('Inductance L').fill('2');
      const limit = page.getByTestId('limit-result');
      // Unfiltered, the PWM voltage passes the table to order 50 but not its whole-waveform THD (issue 9).
      await page.locator('[data-testid="limit-result"][data-pass="false"]').waitFor();
      assert(
        (await page.getByTestId('limit-note').count()) === 1,
        'the note on the content above order 50 is shown',
      );
      await screenshot(page, 'filtered-editor-no-filter');
      const filterBox = page.getByLabel('Include an LC output filter');
      await filterBox.check();
      await page.locator('[data-testid="limit-result"][data-pass="true"]').waitFor();
      await page.getByTestId('filter-resonance').waitFor();
      await filterBox.uncheck();
      await page.locator('[data-testid="limit-result"][data-pass="false"]').waitFor();
      await filterBox.check();
      await page.locator('[data-testid="limit-result"][data-pass="true"]').waitFor();
      assert(
        (await limit.textContent())?.includes('filter output'),
        'the check reads the filter output',
      );
      await page.locator('[data-figure="Output THD"]').waitFor();
      await page.locator('[data-figure="Capacitor current"]').waitFor();
      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      const id = page.url().split('/').pop() ?? '';
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      const editorThd = (await page.locator('[data-figure="THD"]').textContent())?.trim() ?? '';
      const serverLine = (await page.getByTestId('preview-time').textContent()) ?? '';
      assert(/^\d+\.\d\d %$/.test(editorThd), `the editor shows an exact THD (got ${editorThd})`);
      assert(
        serverLine.includes(`THD ${editorThd}`),
        `the saved revision on the server reads the same THD as the live preview (${editorThd}; ${serverLine})`,
      );
      await screenshot(page, 'filtered-editor');

      // Compare: the same figure in the table, from the service's report.
      const listed = (await (
        await fetch(`${context.baseUrl}/api/v1/studies`, {
          headers: { Authorization: `Bearer ${await token(page)}` },
        })
      ).json()) as { id: string; name: string }[];
      const other =
        listed.find((s) => s.name === 'Centred space vector (min-max), 8 kHz') ??
        listed.find((s) => s.id !== id);
      assert(other, 'a second study to compare with');
      await page.goto(`${context.baseUrl}/compare?ids=${id},${other.id}`);
      const cell = page.locator(`tr[data-study="${name}"] [data-column="THD, exact"]`);
      await cell.waitFor();
      const compareThd = (await cell.textContent())?.trim();
      assert(
        compareThd === editorThd,
        `Compare shows the editor's THD (${compareThd} vs ${editorThd})`,
      );
      const compareLimit = (
        await page.locator(`tr[data-study="${name}"] [data-column="Limit check"]`).textContent()
      )?.trim();
      assert(
        compareLimit === 'pass',
        `Compare shows the filtered design passing (got ${compareLimit})`,
      );
      await page.locator('svg[data-chart="spectrum"] g[data-series]').nth(1).waitFor();
      await screenshot(page, 'filtered-compare');

      // The printed report: the same figure again, the limit result and the cautions.
      await page.goto(`${context.baseUrl}/studies/${id}/report`);
      await page.getByText('Pulsewright study report').waitFor();
      const reportThd = (await page.locator('[data-figure="THD"]').textContent())?.trim();
      assert(
        reportThd === editorThd,
        `the printed report shows the editor's THD (${reportThd} vs ${editorThd})`,
      );
      await page.locator('[data-testid="limit-result"][data-pass="true"]').waitFor();
      await page
        .getByTestId('cautions')
        .getByText(/lethal/)
        .waitFor();
      await page.getByText('Carrier frequency').first().waitFor();
      await screenshot(page, 'filtered-report');
      await page.close();
    },
  },
  {
    name: 'a sweep of ma runs as a job and its progress reaches the end',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Index sweeps' }).click();
      await page.getByRole('button', { name: 'Run the sweep' }).click();
      await page.getByTestId('sweep-done').waitFor({ timeout: 30_000 });
      const value = await page.getByRole('progressbar').first().getAttribute('aria-valuenow');
      assert(value === '100', `progress bar at 100 % when done (got ${value})`);
      await page.locator('svg[data-chart="line"] path').first().waitFor();
      await screenshot(page, 'sweep');
      await page.close();
    },
  },
  {
    name: 'an engineer uploads a capture with a progress bar and sees its spectrum',
    async run(context) {
      // An invented bench record: 50 Hz fundamental plus a small 1550 Hz component, 20 kS/s, 0.2 s.
      const rows = ['time,voltage'];
      for (let k = 0; k < 4000; k++) {
        const t = k / 20_000;
        rows.push(
          `${t.toFixed(7)},${(300 * Math.sin(2 * Math.PI * 50 * t) + 12 * Math.sin(2 * Math.PI * 1550 * t)).toFixed(4)}`,
        );
      }
      const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-capture-'));
      const file = path.join(dir, 'bench-e2e.csv');
      writeFileSync(file, rows.join('\n') + '\n');
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Bench captures' }).click();
      await page.getByLabel(/CSV file/).setInputFiles(file);
      await page.getByRole('button', { name: 'Upload' }).click();
      await page.getByText('Uploaded').waitFor();
      const value = await page
        .getByRole('progressbar', { name: 'Upload progress' })
        .getAttribute('aria-valuenow');
      assert(value === '100', `upload progress at 100 % (got ${value})`);
      await page.getByTestId('capture-analysis').waitFor();
      await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();
      await page.getByLabel('Compare with study').selectOption({ index: 1 });
      await page.getByRole('region', { name: 'Order by order' }).waitFor();
      assert(
        (await page.locator('svg[data-chart="spectrum"] g[data-series]').count()) === 2,
        'capture and prediction overlaid',
      );
      await screenshot(page, 'capture');
      await page.close();
    },
  },
  {
    name: 'an engineer creates an API key, sees it once, uses it, and revokes it',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Team' }).click();
      const keyName = `e2e build server ${Date.now()}`;
      await page.getByLabel('Key name').fill(keyName);
      await page.getByRole('button', { name: 'Create key' }).click();
      const key = (await page.getByTestId('new-key').textContent())?.trim() ?? '';
      assert(key.length > 20, 'the new key is shown');
      const before = await fetch(`${context.baseUrl}/api/v1/me`, {
        headers: { Authorization: `Bearer ${key}` },
      });
      assert(before.status === 200, `the key signs a request in (got ${before.status})`);
      await screenshot(page, 'api-key');
      await page.getByRole('button', { name: `Revoke ${keyName}` }).click();
      // Revoking asks first, then takes the new key's secret off the screen.
      await screenshot(page, 'api-key-revoke');
      await page.getByRole('button', { name: `Confirm revoking ${keyName}` }).click();
      await page
        .locator(`tr[data-key-name="${keyName}"]`)
        .getByText(/revoked/)
        .waitFor();
      const after = await fetch(`${context.baseUrl}/api/v1/me`, {
        headers: { Authorization: `Bearer ${key}` },
      });
      assert(after.status === 401, `a revoked key is refused (got ${after.status})`);
      assert(
        (await page.getByTestId('new-key').count()) === 0,
        'the revoked key is off the screen',
      );
      await page.close();
    },
  },
  {
    name: 'a viewer can look and compute but cannot edit, and the API refuses an edit',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'viewer@kestrel.example');
      // The study the engineer made, or else the first one of the demo.
      const listed = await fetch(`${context.baseUrl}/api/v1/studies`, {
        headers: { Authorization: `Bearer ${await token(page)}` },
      });
      const studies = (await listed.json()) as { id: string; revision: number }[];
      const id = context.state.studyId ?? studies[0]?.id;
      const revision = studies.find((s) => s.id === id)?.revision ?? 1;
      assert(id, 'there is a study to open');
      await page.goto(`${context.baseUrl}/studies/${id}`);
      const notice = (await page.getByTestId('read-only').textContent()) ?? '';
      assert(
        notice.includes('You have the viewer role: you can read this design as saved') &&
          !/explore|change the values/.test(notice),
        `the banner says what a viewer can do (got "${notice}")`,
      );
      assert(
        (await page.getByRole('button', { name: 'Save revision' }).count()) === 0,
        'no save button for a viewer',
      );
      assert(
        await page.getByLabel('Name', { exact: true }).isDisabled(),
        'fields are disabled for a viewer',
      );
      assert(
        (await page.getByRole('button', { name: 'Duplicate' }).count()) === 0,
        'no duplicate for a viewer',
      );
      await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();
      const bearer = await token(page);
      const response = await fetch(`${context.baseUrl}/api/v1/studies/${id}`, {
        method: 'PUT',
        headers: { Authorization: `Bearer ${bearer}`, 'Content-Type': 'application/json' },
        body: JSON.stringify({
          baseRevision: revision,
          name: 'viewer edit',
          design: {
            vdc: 400,
            fundamentalFrequency: 50,
            carrierFrequency: 1050,
            modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.5 },
          },
        }),
      });
      assert(response.status === 403, `the API refuses a viewer's edit (got ${response.status})`);
      // Viewers may compute: the live report's harmonic-limit check is shown to them.
      await page
        .getByTestId('limit-result')
        .getByText(/IEEE Std 519/)
        .first()
        .waitFor();
      await screenshot(page, 'viewer-study');
      // The team page by its URL: what it needs, and no key form the service would refuse.
      await page.goto(`${context.baseUrl}/team`);
      await page.getByTestId('team-viewer').waitFor();
      assert(
        (await page.getByLabel('Key name').count()) === 0,
        'no key form for a viewer on the team page',
      );
      await screenshot(page, 'team-viewer');
      await page.close();
    },
  },
  {
    name: 'the browser-side tools render: compare, harmonic elimination, space vector, controller tables',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      // A three-phase demo study: line-to-line output, star-load phase current.
      await page
        .getByRole('link', { name: 'Centred space vector (min-max), 8 kHz', exact: true })
        .click();
      await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();
      // Three-phase figures say what they are of: per phase to the star point, and line to line.
      await page.locator('[data-figure="Fundamental, line-to-line"]').waitFor();
      await page
        .getByText(/peak, phase a to star point/)
        .first()
        .waitFor();
      await page
        .getByText(/Saved revision on the server: THD .* \(exact, phase a to star point\)/)
        .waitFor();
      await screenshot(page, 'study-three-phase');
      await page.getByRole('link', { name: 'Compare', exact: true }).first().click();
      await page.getByRole('heading', { name: 'Compare studies' }).waitFor();
      const boxes = page.getByRole('region', { name: 'Studies' }).getByRole('checkbox');
      await boxes.first().waitFor();
      await boxes.nth(0).check();
      await boxes.nth(1).check();
      await page.locator('svg[data-chart="spectrum"] g[data-series]').nth(1).waitFor();
      await screenshot(page, 'compare');
      await page.getByRole('link', { name: 'Harmonic elimination' }).click();
      await page.getByRole('button', { name: 'Find the branches' }).click();
      await page.locator('svg[data-chart="line"] circle').first().waitFor({ timeout: 30_000 });
      await page.locator('svg[data-chart="line"] circle').nth(5).click();
      await page.getByText('Picked point').waitFor();
      // The picked pattern nulls the orders asked (Patel and Hoft, 1973): its 5th and 7th bars are empty.
      for (const order of [5, 7]) {
        const height = Number(
          await page
            .locator(`svg[data-chart="spectrum"] rect[data-order="${order}"]`)
            .getAttribute('height'),
        );
        assert(height < 0.01, `order ${order} is eliminated (bar height ${height})`);
      }
      await screenshot(page, 'elimination');
      await page.getByRole('link', { name: 'Space vector' }).click();
      await page.locator('svg[data-chart="hexagon"]').waitFor();
      const sector = (await page.getByTestId('sector').textContent())?.trim();
      // θ = 25° lies between V1 (0°) and V2 (60°): sector 1 (van der Broeck et al., 1988).
      assert(sector === '1', `25° is in sector 1 (got ${sector})`);
      await screenshot(page, 'space-vector');
      await page.getByRole('link', { name: 'Controller tables' }).click();
      await page.getByRole('button', { name: 'C header', exact: true }).waitFor();
      await screenshot(page, 'controller-tables');
      await page.close();
    },
  },
  {
    name: 'an engineer saves a picked harmonic-elimination point and a space-vector study, and sees their spectra',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Harmonic elimination' }).click();
      await page.getByRole('button', { name: 'Find the branches' }).click();
      await page.locator('svg[data-chart="line"] circle').first().waitFor({ timeout: 30_000 });
      await page.locator('svg[data-chart="line"] circle').nth(8).click();
      await page.getByText('Picked point').waitFor();
      const project = page.getByLabel('Project');
      const projectValue = await project
        .locator('option')
        .nth(1)
        .getAttribute('value')
        .catch(() => null);
      if (projectValue) await project.selectOption(projectValue);
      const chosen = await project.evaluate((el) => (el as unknown as { value: string }).value);
      const name = `E2E picked pattern ${Date.now()}`;
      await page.getByLabel('Study name').fill(name);
      await page.getByRole('button', { name: 'Save as study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      await page.getByRole('heading', { name }).waitFor();
      const study = (await (
        await fetch(`${context.baseUrl}/api/v1/studies/${page.url().split('/').pop()}`, {
          headers: { Authorization: `Bearer ${await token(page)}` },
        })
      ).json()) as { projectId: string; method: string };
      assert(
        study.method === 'selective-harmonic-elimination' && study.projectId === chosen,
        `saved as a pattern study in the chosen project (${study.method}, ${study.projectId} vs ${chosen})`,
      );
      // Orders 5, 7 eliminated with the fundamental set: three first-quarter angles, listed read-only.
      const rows = page
        .getByRole('table', { name: 'First-quarter switching angles' })
        .locator('tbody tr');
      await rows.first().waitFor();
      assert((await rows.count()) === 3, `three angles listed (got ${await rows.count()})`);
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();
      // The saved pattern still nulls the eliminated orders (Patel and Hoft, 1973).
      for (const order of [5, 7]) {
        const height = Number(
          await page
            .locator(`svg[data-chart="spectrum"] rect[data-order="${order}"]`)
            .first()
            .getAttribute('height'),
        );
        assert(
          height < 0.01,
          `order ${order} stays eliminated in the saved study (bar height ${height})`,
        );
      }
      await screenshot(page, 'study-she');

      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Name', { exact: true }).fill(`E2E space vector ${Date.now()}`);
      await page.getByLabel('Method').selectOption('space-vector');
      await page.getByLabel('Switching sequence').selectOption('five-segment');
      await page.getByLabel('Zero-vector clamping').selectOption('dpwm2');
      await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();
      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      const saved = (await (
        await fetch(`${context.baseUrl}/api/v1/studies/${page.url().split('/').pop()}`, {
          headers: { Authorization: `Bearer ${await token(page)}` },
        })
      ).json()) as { design: { modulation: { clamping?: string; sequence?: string } } };
      assert(
        saved.design.modulation.sequence === 'five-segment' &&
          saved.design.modulation.clamping === 'dpwm2',
        `the clamping chosen is saved (${JSON.stringify(saved.design.modulation)})`,
      );
      await page.getByText(/Revision 1 · space-vector/).waitFor();
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      await page.locator('[data-figure="THD, line-to-line"]').waitFor();
      await screenshot(page, 'study-space-vector');
      // The clamping stays with the design when the sequence that does not read it is chosen,
      // and the form says so (issue 10: it was dropped on the next save).
      await page.getByLabel('Switching sequence').selectOption('seven-segment');
      await page.getByTestId('kept-sequence-option').waitFor();
      await page.getByRole('button', { name: 'Save revision' }).click();
      await page.getByText('Saved as revision 2.').waitFor();
      const resaved = (await (
        await fetch(`${context.baseUrl}/api/v1/studies/${page.url().split('/').pop()}`, {
          headers: { Authorization: `Bearer ${await token(page)}` },
        })
      ).json()) as { design: { modulation: { clamping?: string; sequence?: string } } };
      assert(
        resaved.design.modulation.sequence === 'seven-segment' &&
          resaved.design.modulation.clamping === 'dpwm2',
        `the clamping is kept with the seven-segment sequence (${JSON.stringify(resaved.design.modulation)})`,
      );
      await page.close();
    },
  },
  {
    name: 'an admin invites a member, who follows the e-mailed link and joins with a password',
    async run(context) {
      const email = `newcomer-${Date.now()}@kestrel.example`;
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'admin@kestrel.example');
      await page.getByRole('link', { name: 'Team' }).click();
      await page.getByRole('tab', { name: 'Invitations' }).click();
      await page.getByLabel('E-mail').fill(email);
      await page.getByRole('button', { name: 'Send invitation' }).click();
      await page.getByText(`Invitation sent to ${email}.`).waitFor();
      await page.getByRole('tab', { name: 'Mail outbox' }).click();
      const message = page
        .getByRole('listitem')
        .filter({ hasText: `to ${email}` })
        .first();
      await message.waitFor();
      const text = (await message.textContent()) ?? '';
      // The outbox masks the one-time token; the link works only in the message delivered (issue 11).
      assert(!/token=pwt_[\w-]{16,}/.test(text), 'the outbox shows no live invitation token');
      const link = (
        await waitForDeliveredMail(
          context.baseUrl,
          email,
          /https?:\/\/\S+accept-invitation\?token=[\w-]+/,
        )
      )[0];
      assert(link, 'the delivered invitation e-mail holds a link');
      const path = new URL(link).pathname + new URL(link).search;
      await screenshot(page, 'team-outbox');
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      await page.goto(`${context.baseUrl}${path}`);
      await page.getByLabel('Your name').fill('Noor Vance');
      await page.getByLabel('New password').fill('a-long-enough-password');
      await page.getByRole('button', { name: 'Join' }).click();
      await page.getByTestId('role').waitFor();
      const role = (await page.getByTestId('role').textContent())?.trim();
      assert(role === 'engineer', `the newcomer joins with the invited role (got ${role})`);
      await page.close();
    },
  },
  {
    name: 'an admin sees members, audit log and outbox',
    async run(context) {
      const page = await newPage(context);
      await signIn(page, context.baseUrl, 'admin@kestrel.example');
      await page.getByRole('link', { name: 'Team' }).click();
      await page.getByRole('tab', { name: 'Members' }).click();
      await page.getByText('viewer@kestrel.example').waitFor();
      await page.getByRole('tab', { name: 'Audit log' }).click();
      // This admin's own sign-in is the newest audit event.
      await page.getByRole('tabpanel').getByRole('cell', { name: 'auth.login' }).first().waitFor();
      await screenshot(page, 'team-admin');
      // A password-reset request writes a mail; the outbox must show it to the admin.
      const reset = await page.request.post(`${context.baseUrl}/api/v1/auth/password-reset`, {
        data: { email: 'viewer@kestrel.example' },
      });
      if (!reset.ok()) throw new Error(`password reset answered ${reset.status()}`);
      await page.getByRole('tab', { name: 'Mail outbox' }).click();
      await page.getByRole('tabpanel').getByText('viewer@kestrel.example').first().waitFor();
      await page.close();
    },
  },
];
