/**
 * A new engineer's first hour (issue 10), in the browser: a design with every option of the
 * space-vector method, each number field broken in turn (its own message on that field, in its
 * unit, quoting what was typed, and Save waiting), a sweep read on a log axis with a tracked
 * harmonic, harmonic elimination, the printed report as a PDF read back with pdftotext, and a
 * bench capture compared with a study. Screenshots of each page land in tests/e2e/screenshots/.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import type { Context, Scenario } from './dashboard.e2e.js';
import { assert, screenshot, signIn } from './harness.js';

async function newPage(context: Context): Promise<{ page: Page; consoleErrors: string[] }> {
  const page = await context.browser.newPage({ viewport: { width: 1400, height: 900 } });
  page.setDefaultTimeout(15_000);
  context.lastPage = page;
  const consoleErrors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  return { page, consoleErrors };
}

/** The text box of a labelled field (sliders have a text box beside them). */
const box = (page: Page, label: RegExp) =>
  page.getByLabel(label).and(page.locator('input[type="text"]'));

/** One broken entry: what is typed, the message its field must show, and the value to put back. */
interface Breakage {
  label: RegExp;
  typed: string;
  message: string;
  restore: string;
}

/**
 * Each number field of the space-vector design broken in turn. The ranges are the library's
 * DESIGN_BOUNDS in the unit each field shows (packages/modulation/src/design/designBounds.ts);
 * the words are the form's.
 */
const BREAKAGES: Breakage[] = [
  {
    label: /^DC bus/,
    typed: '1e308',
    message: 'DC bus must be above 0 to 100,000 V (entered 1e+308 V)',
    restore: '650',
  },
  {
    label: /^DC bus/,
    typed: '',
    message: 'Enter a number: DC bus is above 0 to 100,000 V',
    restore: '650',
  },
  {
    label: /^Modulation index ma/,
    typed: 'abc',
    // Space vector: ma up to 4/π (six-step), the library's m ≤ 2√3/π read as ma.
    message: 'Enter a number: Modulation index ma is above 0 to 1.27324',
    restore: '0.9',
  },
  {
    label: /^Modulation index ma/,
    typed: '-1',
    message: 'Modulation index ma must be above 0 to 1.27324 (entered -1)',
    restore: '0.9',
  },
  {
    label: /^Frequency ratio mf/,
    typed: '0.5',
    // Any ratio from 1 is analysed over its span (with this design's filter too): 0.5 is below.
    message: 'Frequency ratio mf must be from 1 to 1,000 (entered 0.5)',
    restore: '81',
  },
  {
    label: /^Fundamental frequency/,
    typed: '0',
    message: 'Fundamental frequency must be from 0.001 to 100,000 Hz (entered 0 Hz)',
    restore: '50',
  },
  {
    label: /^Resistance R/,
    typed: '0',
    message: 'Resistance R must be from 0.000001 to 1,000,000 Ω (entered 0 Ω)',
    restore: '8',
  },
  {
    label: /^Inductance L/,
    typed: '200000',
    message: 'Inductance L must be from 0 to 100,000 mH (entered 200,000 mH)',
    restore: '12',
  },
  {
    label: /^Back-EMF phase/,
    typed: '400',
    message: 'Back-EMF phase must be from -360 to 360 ° (entered 400 °)',
    restore: '0',
  },
  {
    label: /^Filter L/,
    typed: '-1',
    message: 'Filter L must be from 0.000001 to 100,000 mH (entered -1 mH)',
    restore: '1.5',
  },
  {
    label: /^Filter C/,
    typed: '2000000',
    message: 'Filter C must be from 0.000001 to 1,000,000 µF (entered 2,000,000 µF)',
    restore: '15',
  },
  {
    label: /^Damping C/,
    typed: 'x',
    message: 'Enter a number: Damping C is from 0.000001 to 1,000,000 µF',
    restore: '10',
  },
];

/** The text of a PDF, page by page, by poppler's pdftotext (-layout keeps a table row on one line). */
function pdfPages(file: string): string[] {
  const run = spawnSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
  if (run.error || run.status !== 0)
    throw new Error(
      `pdftotext failed (${run.error?.message ?? run.stderr}): apt-get install -y poppler-utils (.ci/run does)`,
    );
  return run.stdout.split('\f');
}

/** Whitespace-collapsed text, so a figure split over layout columns still reads as one line. */
const squeeze = (text: string) => text.replace(/\s+/g, ' ');

export const scenarios: Scenario[] = [
  {
    name: 'first hour: a space-vector design with every option; each broken field shows its own message and Save waits',
    async run(context) {
      const { page, consoleErrors } = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Name', { exact: true }).fill('First hour: space vector, every option');
      await page.getByLabel('Method').selectOption('space-vector');
      await page.getByLabel('Switching sequence').selectOption('five-segment');
      await page.getByLabel('Zero-vector clamping').selectOption('dpwm2');
      await page.getByLabel('Sampling').selectOption('asymmetric');
      const overmodulation = page.getByLabel('Overmodulation');
      const lastMode = await overmodulation.locator('option').last().getAttribute('value');
      assert(lastMode, 'the overmodulation list has options');
      await overmodulation.selectOption(lastMode);
      await box(page, /^DC bus/).fill('650');
      await box(page, /^Modulation index ma/).fill('0.9');
      await box(page, /^Frequency ratio mf/).fill('81');
      // Carrier frequency in Hz beside mf: 81 × 50 Hz.
      assert(
        (await box(page, /^Carrier frequency/).inputValue()) === '4050',
        'the carrier follows mf in Hz',
      );
      await box(page, /^Resistance R/).fill('8');
      await box(page, /^Inductance L/).fill('12');
      await page.getByLabel('Include an LC output filter').check();
      await box(page, /^Filter L/).fill('1.5');
      await box(page, /^Filter C/).fill('15');
      await page.getByLabel('Damping', { exact: true }).selectOption('parallel-rc');
      await box(page, /^Damping R/).fill('2');
      await box(page, /^Damping C/).fill('10');
      // Size L from a resonance target: 1/((2π·1 kHz)²·15 µF) = 1.68869 mH written into Filter L.
      await page.getByLabel('Filter L from').selectOption('resonance');
      await box(page, /^Resonance target/).fill('1000');
      const sized = Number(await box(page, /^Filter L/).inputValue());
      assert(
        Math.abs(sized - 1e3 / ((2 * Math.PI * 1000) ** 2 * 15e-6)) < 1e-6,
        `Filter L follows the resonance target (got ${sized} mH)`,
      );
      await page
        .getByTestId('filter-resonance')
        .getByText(/LC filter resonance 1000 Hz/)
        .waitFor();
      await page.getByLabel('Filter L from').selectOption('typed');
      await box(page, /^Filter L/).fill('1.5');
      const save = page.getByRole('button', { name: 'Create study' });
      await page.getByTestId('filter-resonance').waitFor();
      await page
        .locator('button[title="Correct the marked fields to save"]')
        .waitFor({ state: 'detached' });
      assert(await save.isEnabled(), 'Create study is enabled for a valid design');
      // Three-phase figures say what they are: per phase (star) and line.
      await page.locator('[data-figure="Fundamental, line-to-line"]').waitFor();
      assert(
        /star/i.test(
          (await page.getByRole('group', { name: /Load per phase/ }).textContent()) ?? '',
        ),
        'the load is per phase, star-connected',
      );
      await screenshot(page, 'first-hour-design');

      for (const broken of BREAKAGES) {
        const field = box(page, broken.label);
        await field.fill(broken.typed);
        // The field shows exactly what was typed, never a coerced or remembered value.
        const shown = await field.inputValue();
        assert(shown === broken.typed, `${broken.label} shows "${broken.typed}" (got "${shown}")`);
        await page
          .locator(`[id="${await field.getAttribute('id')}"][aria-invalid="true"]`)
          .waitFor();
        const described = (await field.getAttribute('aria-describedby')) ?? '';
        const message = (await page.locator(`[id="${described}"]`).textContent())?.trim();
        assert(
          message === broken.message,
          `${broken.label} typed "${broken.typed}" shows its message on that field\n  want: ${broken.message}\n  got:  ${message}`,
        );
        assert(await save.isDisabled(), `Create study waits while ${broken.label} is refused`);
        if (broken.typed === '1e308') await screenshot(page, 'first-hour-broken-dc-bus');
        // No other number field is marked, and nothing draws NaN.
        const marked = await page.locator('form input[aria-invalid="true"]').count();
        assert(marked === 1, `only the broken field is marked (${marked} marked)`);
        assert(
          !/\bNaN\b/.test((await page.locator('main').textContent()) ?? ''),
          `no NaN on the page (${broken.label} typed "${broken.typed}")`,
        );
        await field.fill(broken.restore);
        await page
          .locator('form input[aria-invalid="true"]')
          .first()
          .waitFor({ state: 'detached' });
      }
      await page
        .locator('button[title="Correct the marked fields to save"]')
        .waitFor({ state: 'detached' });
      await save.click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      context.state.studyId = page.url().split('/').pop();
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      // Reloaded from the service: every option as chosen.
      await page.reload();
      await page.getByText(/Saved revision on the server: THD/).waitFor();
      for (const [label, value] of [
        ['Switching sequence', 'five-segment'],
        ['Zero-vector clamping', 'dpwm2'],
        ['Sampling', 'asymmetric'],
        ['Overmodulation', lastMode],
      ] as const) {
        const chosen = await page.getByLabel(label, { exact: true }).inputValue();
        assert(chosen === value, `${label} is ${value} after saving (got ${chosen})`);
      }
      await screenshot(page, 'first-hour-saved');
      assert(
        consoleErrors.length === 0,
        `no console errors (got ${consoleErrors.length}: ${consoleErrors.slice(0, 3).join(' | ')})`,
      );
      await page.close();
    },
  },
  {
    name: 'first hour: a sweep read on a log THD axis and a tracked harmonic against ma',
    async run(context) {
      const { page } = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Index sweeps' }).click();
      const points = box(page, /^Points/);
      // An emptied field stays empty and is refused on the field; it is never refilled with 0.
      await points.fill('');
      assert((await points.inputValue()) === '', 'an emptied sweep field stays empty');
      await page.getByRole('button', { name: 'Run the sweep' }).isDisabled();
      await points.fill('1.2');
      assert((await points.inputValue()) === '1.2', 'typing after emptying gives 1.2, not 01.2');
      assert(
        await page.getByRole('button', { name: 'Run the sweep' }).isDisabled(),
        'Run waits while points is refused',
      );
      await points.fill('40');
      await box(page, /^ma to/).fill('2');
      // A three-phase sweep reads the line a−b voltage, and its charts say so (issue 10).
      await page.getByRole('combobox', { name: 'Method', exact: true }).selectOption('three-phase');
      await page.getByRole('button', { name: 'Run the sweep' }).click();
      await page.getByTestId('sweep-done').waitFor({ timeout: 60_000 });
      const distortion = page.locator('svg[data-chart="line"]').first();
      assert(
        (await distortion.getAttribute('data-scale')) === 'log',
        'THD reads on a log axis by default',
      );
      await page.getByRole('combobox', { name: 'Harmonic shown' }).selectOption('21');
      await page.getByText('Fundamental and order 21 against ma, line a−b').waitFor();
      await page.getByText('THD and WTHD against ma, line a−b').waitFor();
      await screenshot(page, 'first-hour-sweep');
      await page.getByRole('combobox', { name: 'THD axis' }).selectOption('range');
      await box(page, /^THD axis up to/).fill('150');
      assert(
        (await distortion.textContent())?.includes('150 %'),
        'the picked range tops the THD axis at 150 %',
      );
      await screenshot(page, 'first-hour-sweep-range');
      await page.close();
    },
  },
  {
    name: 'first hour: controller tables — a name prefix, a slow timer clock refused on its own field, a clean C header',
    async run(context) {
      const { page } = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Controller tables' }).click();
      await page
        .getByLabel(/^Name prefix/)
        .first()
        .fill('kestrel_drive');
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: 'C header', exact: true }).click(),
      ]);
      const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-header-'));
      try {
        const file = path.join(dir, 'table.h');
        await download.saveAs(file);
        const header = readFileSync(file, 'utf8');
        assert(
          download.suggestedFilename() === 'kestrel_drive.h',
          'the file is named by the prefix',
        );
        assert(
          header.includes('static const uint16_t kestrel_drive_a_high[KESTREL_DRIVE_LENGTH]'),
          'the arrays and macros carry the prefix',
        );
        // 500 ns typed in ns: printed as 500 ns, never 5.000000000000001e-7 s.
        assert(/deadTime\s+500 ns requested/.test(header), 'the dead time prints cleanly in ns');
        assert(!/\d[\d.]{15,}/.test(header), 'no number printed with binary rounding');
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
      // A 1 kHz timer clock cannot run a 10 kHz carrier: the timer clock, typed last, says so.
      const clock = box(page, /^Timer clock/).first();
      await clock.fill('1000');
      await page.locator(`[id="${await clock.getAttribute('id')}"][aria-invalid="true"]`).waitFor();
      const described = (await clock.getAttribute('aria-describedby')) ?? '';
      const message = (await page.locator(`[id="${described}"]`).textContent())?.trim();
      assert(
        message === 'Timer clock must be at least twice the carrier, 20,000 Hz (entered 1,000 Hz)',
        `the timer clock carries its message (got ${message})`,
      );
      assert(
        !(await box(page, /^Carrier/).getAttribute('aria-invalid')),
        'the carrier field is not marked',
      );
      await screenshot(page, 'first-hour-controller-tables');
      await page.close();
    },
  },
  {
    name: 'first hour: harmonic elimination finds its branches',
    async run(context) {
      const { page } = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      await page.getByRole('link', { name: 'Harmonic elimination' }).click();
      await page.getByRole('button', { name: /^Find the branch/ }).click();
      await page.locator('svg[data-chart="line"]').first().waitFor({ timeout: 60_000 });
      await screenshot(page, 'first-hour-elimination');
      await page.close();
    },
  },
  {
    name: 'first hour: the printed report as a PDF holds every harmonic row, the whole design, the figures, the limit result and the cautions',
    async run(context) {
      const { page } = await newPage(context);
      await signIn(page, context.baseUrl, 'engineer@kestrel.example');
      // A bipolar bridge in the linear range: its fundamental is ma·vdc (a fact of the trade,
      // docs/references.md), 0.8 × 400 V = 320 V.
      await page.goto(`${context.baseUrl}/studies/new`);
      await page.getByLabel('Name', { exact: true }).fill('First hour: printed bipolar bridge');
      await box(page, /^DC bus/).fill('400');
      await box(page, /^Modulation index ma/).fill('0.8');
      await box(page, /^Frequency ratio mf/).fill('21');
      await page.getByLabel('Include an LC output filter').check();
      await page.getByTestId('filter-resonance').waitFor();
      await page
        .locator('button[title="Correct the marked fields to save"]')
        .waitFor({ state: 'detached' });
      await page.getByRole('button', { name: 'Create study' }).click();
      await page.waitForURL(/\/studies\/[0-9a-f-]{36}$/);
      const id = page.url().split('/').pop() ?? '';
      await page.goto(`${context.baseUrl}/studies/${id}/report`);
      await page.getByText('Pulsewright study report').waitFor();
      await page.locator('[data-testid="limit-result"]').first().waitFor();
      await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();

      // What the screen shows: every row of each harmonic table and every figure card.
      const rows: string[][] = [];
      for (const tr of await page.locator('section[aria-label^="Harmonics,"] tbody tr').all())
        rows.push((await tr.locator('td').allTextContents()).map((t) => t.trim()));
      assert(rows.length > 13, `the harmonic tables hold more than 13 rows (got ${rows.length})`);
      const figures: [string, string][] = [];
      for (const card of await page.locator('[data-figure]').all())
        figures.push([
          (await card.getAttribute('data-figure')) ?? '',
          ((await card.textContent()) ?? '').trim(),
        ]);
      const fundamental = figures.find(([label]) => label === 'Fundamental')?.[1];
      assert(fundamental === '320 V', `the fundamental is ma·vdc = 320 V (got ${fundamental})`);
      await screenshot(page, 'first-hour-report');

      const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-report-'));
      try {
        const file = path.join(dir, 'report.pdf');
        await page.emulateMedia({ media: 'print' });
        await page.pdf({ path: file, format: 'A4', printBackground: true });
        const pages = pdfPages(file);
        const text = pages.join('\n');
        const flat = squeeze(text);
        for (const cells of rows) {
          const [order, group, amplitude, percent] = cells;
          const line = text
            .split('\n')
            .find((l) => squeeze(l).trim().startsWith(`${order} ${group} ${amplitude}`));
          assert(
            line !== undefined && squeeze(line).includes(percent ?? ''),
            `the PDF prints harmonic row ${cells.join(' | ')}`,
          );
        }
        for (const [label, value] of figures) {
          assert(flat.includes(squeeze(value)), `the PDF prints ${label}: ${value}`);
        }
        for (const expected of [
          'Revision 1 by engineer@kestrel.example',
          'Carrier frequency 1050 Hz (mf 21)',
          'DC bus 400 V',
          'LC filter L 2 mH, C 20 µF',
          'Load R 10 Ω, L 20 mH',
          'exact, whole waveform',
          'IEEE Std 519',
          '2022',
          'recalled from memory',
          'lethal',
        ]) {
          assert(flat.includes(expected), `the PDF prints "${expected}"`);
        }
        assert(!/scroll or pinch/i.test(flat), 'no screen-only hints in the PDF');
        // The modulator chart is whole on one page: its title and its angle axis together.
        const chartPage = pages.find((p) => p.includes('MODULATOR AND BRIDGE VOLTAGE'));
        assert(
          chartPage !== undefined && chartPage.includes('angle θ'),
          'the modulator chart is not split across a page break',
        );
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
      await page.close();
    },
  },
  {
    name: 'first hour: an exactly periodic square-wave capture compared with a study',
    async run(context) {
      // ±100 V, 50 Hz square wave sampled at 100 kHz over 5 periods: its fundamental is
      // 4·100/π = 127.32 V (Fourier series of a square wave, any signals text).
      const rows = ['time,voltage'];
      for (let k = 0; k < 10_000; k++) {
        const t = k / 100_000;
        rows.push(`${t.toFixed(7)},${(k % 2000) + 0.5 < 1000 ? 100 : -100}`);
      }
      const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-capture-'));
      try {
        const file = path.join(dir, 'square-e2e.csv');
        writeFileSync(file, rows.join('\n') + '\n');
        const { page } = await newPage(context);
        await signIn(page, context.baseUrl, 'engineer@kestrel.example');
        await page.getByRole('link', { name: 'Bench captures' }).click();
        await page.getByLabel(/CSV file/).setInputFiles(file);
        await page.getByRole('button', { name: 'Upload' }).click();
        await page.getByText('Uploaded').waitFor();
        const analysis = page.getByTestId('capture-analysis');
        await analysis.waitFor();
        await page.locator('svg[data-chart="spectrum"] rect[data-bar]').first().waitFor();
        // The spectrum's readout (hover): 4·100/π = 127.3 V and 4·100/(3π) = 42.44 V.
        const spectrum = page.locator('svg[data-chart="spectrum"]').first();
        for (const [order, volts] of [
          [1, '127.3 V'],
          [3, '42.44 V'],
        ] as const) {
          await spectrum.locator(`rect[data-order="${order}"]`).first().hover();
          const readout = (await spectrum.textContent()) ?? '';
          assert(
            readout.includes(`order ${order}`) && readout.includes(volts),
            `the capture reads order ${order} as ${volts} (Fourier series of the square wave)`,
          );
        }
        // Read over whole periods with no window: the window field says it is not applied.
        const windowField = page.getByRole('combobox', { name: 'FFT window' });
        assert(
          ((await windowField.getAttribute('aria-describedby')) ?? '') !== '' &&
            (await analysis.textContent())?.includes('not applied: this capture repeats exactly'),
          'the window field says the exactly periodic capture is read with no window',
        );
        // The Hz axis: order 3 of a 50 Hz capture sits at 150 Hz.
        await page.getByRole('button', { name: 'Axis in Hz' }).click();
        await spectrum.locator('rect[data-order="3"]').first().hover();
        assert(
          ((await spectrum.textContent()) ?? '').includes('150 Hz'),
          'the Hz axis reads order 3 at 150 Hz',
        );
        await page.getByLabel('Compare with study').selectOption({ index: 1 });
        await page.getByRole('region', { name: 'Order by order' }).waitFor();
        await screenshot(page, 'first-hour-capture');
        await page.close();
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  },
];
