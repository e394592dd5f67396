// Installs the workspace's dependencies when they are missing or older than the lock file,
// so `npm start` and `npm test` work on a fresh clone with nothing installed beforehand.
import { existsSync, statSync } from 'node:fs';
import { execSync } from 'node:child_process';

const marker = 'node_modules/.package-lock.json';
const lock = 'package-lock.json';
const stale =
  !existsSync(marker) || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs);
if (stale) {
  const command = existsSync(lock)
    ? 'npm ci --no-audit --no-fund'
    : 'npm install --no-audit --no-fund';
  // npm 11 warns of every package whose install scripts the project has not reviewed; the root
  // package.json's allowScripts reviews them (esbuild checks its binary, sqlite3 compiles its
  // native module, @scarf/scarf's analytics are refused), so a clean install prints none.
  console.log(
    `pulsewright: installing dependencies (${command}); sqlite3 compiles from source, about 1.5 minutes ...`,
  );
  execSync(command, {
    stdio: 'inherit',
    env: { ...process.env, SCARF_ANALYTICS: 'false', TURBO_TELEMETRY_DISABLED: '1' },
  });
  console.log(
    "pulsewright: dependencies installed (any 'npm warn' lines above are notices: the install succeeded).",
  );
}
