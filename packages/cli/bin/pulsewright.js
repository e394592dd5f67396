#!/usr/bin/env node
// The `pulsewright` command: runs the built CLI (dist/). In a fresh clone, where nothing is built
// yet, it builds this package and the library once (turbo, output on stderr so stdout stays the
// command's own), then runs.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { ensureBuilt } from './ensureBuilt.js';

// A reader that stops early (`| head`) closes the pipe: end quietly, as other command-line tools do.
process.stdout.on('error', (error) => {
  if (error.code === 'EPIPE') process.exit(0);
  throw error;
});
const main = fileURLToPath(new URL('../dist/main.js', import.meta.url));
if (!existsSync(main)) ensureBuilt();
const { main: run } = await import('../dist/main.js');
process.exitCode = await run(process.argv.slice(2));
