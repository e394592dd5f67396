// Builds @pulsewright/modulation (when its dist/ is missing) and this package, for a fresh clone
// where `npm install` has linked the bin but nothing is built yet. Output goes to stderr so
// the command's stdout stays byte-identical from the first run on.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export function ensureBuilt() {
  const root = fileURLToPath(new URL('../../../', import.meta.url));
  const library = fileURLToPath(new URL('../../modulation/dist/index.js', import.meta.url));
  const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
  const build = (workspace) => {
    process.stderr.write(`pulsewright: building ${workspace} (first run in this checkout) ...\n`);
    execFileSync(npm, ['run', 'build', `--workspace=${workspace}`], {
      cwd: root,
      stdio: ['ignore', 2, 2],
    });
  };
  if (!existsSync(library)) build('@pulsewright/modulation');
  build('@pulsewright/cli');
}
