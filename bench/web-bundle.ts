/**
 * Dashboard bench: gzip size of the JavaScript the first page load fetches from apps/web/dist
 * (the entry script plus its modulepreload links; lazy feature chunks excluded), against the
 * 350 kB goal, and the live-preview recompute time of the study editor at mf = 101 (the
 * library call the editor makes on every slider move), against one 60 Hz frame (16 ms).
 * Needs `npm run build` first (the bench script runs turbo build).
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { medianTime, printTable } from './measure.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const dist = join(root, 'apps', 'web', 'dist');
const kB = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`;

const rows: [string, string][] = [];
const indexPath = join(dist, 'index.html');
if (existsSync(indexPath)) {
  const html = readFileSync(indexPath, 'utf8');
  const scripts = [
    ...html.matchAll(/<script[^>]+type="module"[^>]+src="([^"]+)"/g),
    ...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+)"/g),
  ].map((m) => m[1] as string);
  const styles = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map(
    (m) => m[1] as string,
  );
  const size = (files: string[]) =>
    files.reduce(
      (sum, file) => {
        const bytes = readFileSync(join(dist, file.replace(/^\//, '')));
        return {
          raw: sum.raw + bytes.length,
          gzip: sum.gzip + gzipSync(bytes, { level: 9 }).length,
        };
      },
      { raw: 0, gzip: 0 },
    );
  const js = size(scripts);
  const css = size(styles);
  rows.push(['initial JS files', String(scripts.length)]);
  rows.push(['initial JS (raw)', kB(js.raw)]);
  rows.push(['initial JS (gzip)', kB(js.gzip)]);
  rows.push(['initial JS gzip / 350 kB goal', `${((js.gzip / (350 * 1024)) * 100).toFixed(0)} %`]);
  rows.push(['initial CSS (gzip)', kB(css.gzip)]);
} else {
  rows.push(['initial JS (gzip)', 'apps/web/dist missing: build first']);
}

// The editor's preview module; a computed path so this folder's type check does not compile the web app.
const previewModule = '../apps/web/src/features/studies/model/computePreview.ts';
const draftModule = '../apps/web/src/features/studies/model/studyDraft.ts';
type Draft = Record<string, unknown>;
const { computePreview } = (await import(previewModule)) as {
  computePreview: (draft: Draft) => { preview: unknown; errors: unknown[] };
};
const { defaultDraft } = (await import(draftModule)) as { defaultDraft: () => Draft };

const cases: [string, Draft][] = [
  [
    'sine-triangle bipolar, mf 101',
    { ...defaultDraft(), method: 'sine-triangle', scheme: 'bipolar', mf: 101, ma: 0.9 },
  ],
  [
    'sine-triangle unipolar, mf 101',
    { ...defaultDraft(), method: 'sine-triangle', scheme: 'unipolar', mf: 101, ma: 0.9 },
  ],
  [
    'three-phase min-max, mf 101',
    { ...defaultDraft(), method: 'three-phase', zeroSequence: 'min-max', mf: 101, ma: 1.0 },
  ],
  [
    'space vector 7-segment, mf 101',
    { ...defaultDraft(), method: 'space-vector', mf: 101, ma: 1.0 },
  ],
  ['sine-triangle bipolar, mf 21', { ...defaultDraft(), mf: 21 }],
];
for (const [label, draft] of cases) {
  const check = computePreview(draft);
  if (!check.preview)
    throw new Error(`preview failed for ${label}: ${JSON.stringify(check.errors)}`);
  const ms = medianTime(() => computePreview(draft), 30, 5);
  rows.push([
    `live preview: ${label} (median)`,
    `${ms.toFixed(2)} ms (${((ms / 16) * 100).toFixed(0)} % of a 16 ms frame)`,
  ]);
}

printTable('Dashboard: initial bundle and live preview', rows);
