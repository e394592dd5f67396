// `npm start`: builds the API (with the library it needs) and, when it builds, the dashboard,
// then runs the service on PORT (default 3000), serving the dashboard from apps/web/dist.
// A new database (DATABASE_URL, default data/pulsewright.sqlite) is migrated and seeded with
// the Kestrel Drives demo. Dependencies are installed beforehand by scripts/ensure-install.mjs.
//
// This process supervises the service: when the service exits without being asked to (a crash,
// an out-of-memory kill), it is started again after a back-off of 1 s, doubling to at most
// RESTART_MAX_DELAY_MS (default 30 s) and back to 1 s once a run has lasted a minute. On SQLite
// each start marks the jobs the last run left queued or running as failed; on PostgreSQL the
// shared job queue gives them to a replica again (docs/api.md, "Replicas"). Five runs in a row that each end
// within 10 s of their start are a crash loop (a bad setting, a database that cannot open): the
// supervisor then stops with exit code 1 rather than retry forever (RESTART_DELAY_MS sets the first
// pause, 1 s by default). SIGINT and SIGTERM are passed
// to the service, and the supervisor exits with the service's code once it has stopped.
// PULSEWRIGHT_NO_BUILD=1 skips the build (the tests use it on a tree built already).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const env = { ...process.env, TURBO_TELEMETRY_DISABLED: '1', SCARF_ANALYTICS: 'false' };
const turbo = path.join(
  root,
  'node_modules',
  '.bin',
  process.platform === 'win32' ? 'turbo.cmd' : 'turbo',
);
const entry = path.join(root, 'apps', 'api', 'dist', 'index.js');

function build(filter) {
  const result = spawnSync(
    turbo,
    ['run', 'build', `--filter=${filter}`, '--output-logs=errors-only'],
    {
      cwd: root,
      env,
      stdio: 'inherit',
    },
  );
  return result.status === 0;
}

if (process.env.PULSEWRIGHT_NO_BUILD !== '1') {
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
} else if (!existsSync(entry)) {
  console.error(
    `pulsewright: ${entry} is missing; build first (npm run build) or leave PULSEWRIGHT_NO_BUILD unset.`,
  );
  process.exit(1);
}

const FIRST_DELAY_MS =
  Number(process.env.RESTART_DELAY_MS) > 0 ? Number(process.env.RESTART_DELAY_MS) : 1000;
const MAX_DELAY_MS =
  Number(process.env.RESTART_MAX_DELAY_MS) > 0 ? Number(process.env.RESTART_MAX_DELAY_MS) : 30_000;
/** A run this long resets the back-off. */
const HEALTHY_RUN_MS = 60_000;
/** A run shorter than this counts towards a crash loop. */
const SHORT_RUN_MS = 10_000;
const CRASH_LOOP_RUNS = 5;

let server;
let stopping = false;
let restartTimer;
let delay = FIRST_DELAY_MS;
let shortRuns = 0;

/**
 * Node.js settings of the service. A young generation of 64 MB a semi-space (V8's default is 16 MB
 * on 64-bit): a spectrum's answer makes about 0.9 MB of short-lived objects, and with the default
 * the service spent 7–13 % of its CPU under load in scavenges (CPU profiles), each copying the
 * answers still in flight; fewer, larger ones cost less (docs/robustness.md, throughput). At most
 * about 200 MB more memory. bench/throughput.ts runs with the same setting.
 */
const SERVICE_NODE_FLAGS = ['--max-semi-space-size=64'];

function startService() {
  const startedAt = Date.now();
  // Production unless NODE_ENV says otherwise: answers are not re-validated (apps/api config.ts).
  server = spawn(process.execPath, [...SERVICE_NODE_FLAGS, entry], {
    cwd: root,
    env: { NODE_ENV: 'production', ...env },
    stdio: 'inherit',
  });
  console.log(`pulsewright: service started (pid ${server.pid})`);
  server.on('exit', (code, signal) => {
    const ran = Date.now() - startedAt;
    const how = signal ? `signal ${signal}` : `code ${code}`;
    if (stopping) process.exit(code ?? (signal ? 1 : 0));
    if (ran >= HEALTHY_RUN_MS) delay = FIRST_DELAY_MS;
    shortRuns = ran < SHORT_RUN_MS ? shortRuns + 1 : 0;
    if (shortRuns >= CRASH_LOOP_RUNS) {
      console.error(
        `pulsewright: the service exited (${how}) ${CRASH_LOOP_RUNS} times in a row within ${SHORT_RUN_MS / 1000} s of starting; not restarting it. See the errors above.`,
      );
      process.exit(1);
    }
    console.error(
      `pulsewright: the service exited (${how}) after ${(ran / 1000).toFixed(1)} s; restarting it in ${delay / 1000} s`,
    );
    restartTimer = setTimeout(startService, delay);
    delay = Math.min(2 * delay, MAX_DELAY_MS);
  });
}

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    stopping = true;
    if (restartTimer) {
      clearTimeout(restartTimer);
      restartTimer = undefined;
      if (server.exitCode !== null || server.signalCode !== null) process.exit(0);
    }
    server.kill(signal);
  });
}

startService();
