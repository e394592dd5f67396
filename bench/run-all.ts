/**
 * Runs every benchmark in this folder, each in its own process (so one's JIT state and memory do
 * not colour another's), and writes their printed figures to bench/results.md. Benchmarks are
 * not tests: they print ratios measured within one run and never fail on a threshold.
 */
import { execFileSync } from 'node:child_process';
import { readdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const folder = dirname(fileURLToPath(import.meta.url));
const skip = new Set(['run-all.ts', 'measure.ts', 'spectrumBaselines.ts']);
const benchmarks = readdirSync(folder)
  .filter((name) => name.endsWith('.ts') && !name.endsWith('.d.ts') && !skip.has(name))
  .sort();

const sections: string[] = [
  `# Benchmark results\n\nMeasured ${new Date().toISOString()} on ${process.platform}/${process.arch}, Node.js ${process.version}.\n`,
];
for (const name of benchmarks) {
  console.log(`bench: running ${name} ...`);
  try {
    const output = execFileSync(process.execPath, ['--import', 'tsx', join(folder, name)], {
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'inherit'],
      timeout: 5 * 60_000,
    });
    console.log(output);
    sections.push(
      `## ${name}\n\n${output.trim().startsWith('###') || output.includes('|') ? output.trim() : '```\n' + output.trim() + '\n```'}\n`,
    );
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    console.error(`bench: ${name} failed: ${message}`);
    sections.push(`## ${name}\n\nFailed: ${message}\n`);
  }
}
writeFileSync(join(folder, 'results.md'), sections.join('\n'));
console.log(`bench: wrote ${join(folder, 'results.md')}`);
