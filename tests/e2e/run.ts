/**
 * Browser tests of the dashboard: starts the built API + dashboard on a free port with a fresh
 * database, drives Debian's chromium through playwright-core, and runs every scenario of the
 * *.e2e.ts files in order. Screenshots land in tests/e2e/screenshots/ (git-ignored).
 * `E2E_BASE_URL=http://127.0.0.1:3000` uses a running service instead (development).
 */
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import type { Scenario, Context } from './dashboard.e2e.js';
import { repoRoot } from '../support/server.js';
import { launchBrowser, screenshot, startService, type Service } from './harness.js';

const dir = path.join(repoRoot, 'tests', 'e2e');
const files = readdirSync(dir)
  .filter((f) => f.endsWith('.e2e.ts'))
  .sort();
const scenarios: Scenario[] = [];
for (const file of files) {
  const module = (await import(pathToFileURL(path.join(dir, file)).href)) as {
    scenarios?: Scenario[];
  };
  scenarios.push(...(module.scenarios ?? []));
}
const filter = process.argv[2];

let service: Service | null = null;
let failures = 0;
const started = Date.now();
try {
  const baseUrl = process.env.E2E_BASE_URL ?? (service = await startService()).baseUrl;
  const browser = await launchBrowser();
  const context: Context = { browser, baseUrl, state: {} };
  try {
    for (const scenario of scenarios) {
      if (filter && !scenario.name.includes(filter)) continue;
      const t0 = Date.now();
      delete context.lastPage;
      try {
        await scenario.run(context);
        console.log(`  ✓ ${scenario.name} (${Date.now() - t0} ms)`);
      } catch (error) {
        failures++;
        // A cast: the compiler keeps the narrowing from before the scenario ran.
        const last = context.lastPage as Page | undefined;
        if (last && !last.isClosed()) {
          await screenshot(last, `failed-${failures}`).catch(() => undefined);
          await last.close().catch(() => undefined);
        }
        console.log(
          `  ✗ ${scenario.name}\n    ${error instanceof Error ? error.message.split('\n').join('\n    ') : String(error)}`,
        );
      }
    }
  } finally {
    await browser.close();
  }
} catch (error) {
  failures++;
  console.error(error instanceof Error ? error.message : error);
} finally {
  if (failures && service) console.log(`--- service log ---\n${service.log().slice(-4000)}`);
  await service?.stop();
}
console.log(
  `e2e: ${scenarios.length} scenarios, ${failures} failed, ${((Date.now() - started) / 1000).toFixed(1)} s`,
);
process.exit(failures ? 1 : 0);
