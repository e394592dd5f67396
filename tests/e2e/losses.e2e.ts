/**
 * Losses in the design report and Compare at equal conditions (issue 12), in the browser: two
 * saved three-phase drives with the same IGBT (continuous SPWM and DPWM1 at mf 99) show their loss
 * bars by device in the editor, and Compare at equal average device switching frequency runs the
 * DPWM1 design's carrier about 1.5× faster (A. M. Hava, R. J. Kerkman, T. A. Lipo, 1999; from
 * memory), with the adjusted carrier in its row. Screenshots: tests/e2e/screenshots/losses-editor.png,
 * compare-equal-conditions.png.
 */
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../support/server.js';
import type { Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

/** An invented IGBT (datasheet-like values, not a real part). */
const DEVICE = {
  kind: 'igbt',
  vce0: 0.9,
  rce: 0.012,
  vf0: 1.05,
  rf: 0.009,
  eon: 2.1e-3,
  eoff: 2.6e-3,
  err: 1.3e-3,
  referenceVoltage: 600,
  referenceCurrent: 100,
};

const drive = (zeroSequence: 'none' | 'dpwm1') => ({
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 4950,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence },
  load: { r: 8, l: 0.01 },
  device: DEVICE,
});

/** The number a table cell shows. */
const numberIn = async (page: Page, selector: string): Promise<number> =>
  Number(((await page.locator(selector).textContent()) ?? '').replace(/[^0-9.eE+-]/g, ''));

export const scenarios: Scenario[] = [
  {
    name: 'losses by device in the editor, and Compare at equal device switching frequency',
    async run(context) {
      const api = async (path: string, init: RequestInit = {}, bearer?: string) => {
        const res = await fetch(`${context.baseUrl}/api/v1${path}`, {
          ...init,
          headers: {
            'Content-Type': 'application/json',
            ...(bearer ? { Authorization: `Bearer ${bearer}` } : {}),
          },
        });
        assert(res.ok, `${path}: ${res.status} ${await res.clone().text()}`);
        return res.json() as Promise<Record<string, unknown>>;
      };
      const { token } = (await api('/auth/login', {
        method: 'POST',
        body: JSON.stringify({ email: 'engineer@kestrel.example', password: DEMO_PASSWORD }),
      })) as { token: string };
      const projects = (await api('/projects', {}, token)) as unknown as { id: string }[];
      const projectId = projects[0]?.id;
      assert(projectId, 'a demo project');
      const stamp = Date.now();
      const create = async (name: string, zeroSequence: 'none' | 'dpwm1') =>
        (
          (await api(
            '/studies',
            {
              method: 'POST',
              body: JSON.stringify({ projectId, name, design: drive(zeroSequence) }),
            },
            token,
          )) as { id: string }
        ).id;
      const spwmName = `E2E SPWM with IGBT ${stamp}`;
      const dpwmName = `E2E DPWM1 with IGBT ${stamp}`;
      const spwm = await create(spwmName, 'none');
      const dpwm = await create(dpwmName, 'dpwm1');

      const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
      page.setDefaultTimeout(20_000);
      context.lastPage = page;
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/${dpwm}`);
      const chart = page.getByRole('figure', { name: 'Losses by device (IGBT and diode)' });
      await chart.waitFor();
      const bars = await chart.locator('g[data-bar]').count();
      assert(bars === 12, `a bar for each of the 12 devices (got ${bars})`);
      assert(
        (await page.getByLabel('Device for the losses').inputValue()) === 'igbt',
        'the form shows the stored device',
      );
      await chart.scrollIntoViewIfNeeded();
      await screenshot(page, 'losses-editor');

      await page.goto(`${context.baseUrl}/compare?ids=${spwm},${dpwm}`);
      const carrierCell = (name: string) => `tr[data-study="${name}"] [data-column="Carrier (Hz)"]`;
      await page.locator(carrierCell(dpwmName)).waitFor();
      assert(
        (await numberIn(page, carrierCell(dpwmName))) === 4950,
        'at equal carrier the DPWM1 design keeps 4950 Hz',
      );
      await page.getByLabel('Compare at').selectOption('equal-device-frequency');
      await page.locator(carrierCell(dpwmName)).filter({ hasNotText: '4950' }).waitFor();
      const carrier = await numberIn(page, carrierCell(dpwmName));
      assert(
        carrier / 4950 > 1.47 && carrier / 4950 < 1.53,
        `DPWM1 runs its carrier about 1.5× faster at equal device switching frequency (got ${carrier} Hz)`,
      );
      assert(
        (await numberIn(page, carrierCell(spwmName))) === 4950,
        'the reference keeps its carrier',
      );
      await screenshot(page, 'compare-equal-conditions');
      await page.close();
    },
  },
];
