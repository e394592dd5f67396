// `npm start`: builds the API (with the library it needs) and, when it builds, the dashboard,
// then runs the service on PORT (default 3000), serving the dashboard from apps/web/dist.
// A new database (DATABASE_URL, default data/pulsewright.sqlite) is migrated and seeded with
// the Kestrel Drives demo. Dependencies are installed beforehand by scripts/ensure-install.mjs.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const env = { ...process.env, TURBO_TELEMETRY_DISABLED: '1', SCARF_ANALYTICS: 'false' };
const turbo = path.join(root, 'node_modules', '.bin', process.platform === 'win32' ? 'turbo.cmd' : 'turbo');

function build(filter) {
  const result = spawnSync(turbo, ['run', 'build', `--filter=${filter}`, '--output-logs=errors-only'], {
    cwd: root,
    env,
    stdio: 'inherit',
  });
  return result.status === 0;
}

console.log('pulsewright: building the API ...');
if (!build('@pulsewright/api')) {
  console.error('pulsewright: the API did not build; see the errors above.');
  process.exit(1);
}
const webDist = path.join(root, 'apps', 'web', 'dist', 'index.html');
if (existsSync(path.join(root, 'apps', 'web', 'package.json'))) {
  console.log('pulsewright: building the dashboard ...');
  if (!build('@pulsewright/web')) {
    console.warn(
      existsSync(webDist)
        ? 'pulsewright: the dashboard did not build; serving the previous build in apps/web/dist.'
        : 'pulsewright: the dashboard did not build; the API runs and / says the dashboard is not built.',
    );
  }
}

const server = spawn(process.execPath, [path.join(root, 'apps', 'api', 'dist', 'index.js')], {
  cwd: root,
  env,
  stdio: 'inherit',
});
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => server.kill(signal));
}
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
