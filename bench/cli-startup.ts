/**
 * Benchmark (not a test): wall time of `pulsewright spectrum` (bipolar, ma 0.8, mf 21, spectrum
 * to order 1050, as issue 15 asks) against `node -e 0` started the same way, in one run. Issue
 * 15's goal: under 300 ms of wall time. Median of 15 runs each, after 3 untimed.
 */
import { execFileSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { printTable } from './measure.js';

const bin = join(
  dirname(fileURLToPath(import.meta.url)),
  '..',
  'packages',
  'cli',
  'bin',
  'pulsewright.js',
);
const spectrum = [
  bin,
  'spectrum',
  '--method',
  'sine-triangle',
  '--scheme',
  'bipolar',
  '--ma',
  '0.8',
  '--vdc',
  '400',
  '--fundamental-frequency',
  '50',
  '--carrier-frequency',
  '1050',
  '--max-order',
  '1050',
];

function medianWall(args: string[]): number {
  const run = () => execFileSync(process.execPath, args, { stdio: ['ignore', 'pipe', 'pipe'] });
  for (let i = 0; i < 3; i++) run();
  const times: number[] = [];
  for (let i = 0; i < 15; i++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[7] as number;
}

const bare = medianWall(['-e', '0']);
const cli = medianWall(spectrum);
printTable('pulsewright spectrum start to finish (median wall ms, one run)', [
  ['node -e 0', `${bare.toFixed(0)} ms (1.00)`],
  [
    'pulsewright spectrum, mf 21, orders to 1050',
    `${cli.toFixed(0)} ms (${(cli / bare).toFixed(1)}×)`,
  ],
  ['issue 15 goal', '300 ms'],
]);
