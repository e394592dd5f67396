import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
// The reader of the service's own mail drop format, from its source (as the in-process suites do).
import { readMailDrop, type DeliveredMail } from '../../apps/api/src/services/mail.js';

/** The repository root (tests/support → two levels up). */
export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const apiEntry = path.join(repoRoot, 'apps', 'api', 'dist', 'index.js');
export const DEMO_PASSWORD = 'pulsewright-demo';
export const DEMO = {
  admin: 'admin@kestrel.example',
  engineer: 'engineer@kestrel.example',
  engineer2: 'engineer2@kestrel.example',
  viewer: 'viewer@kestrel.example',
} as const;

/** A new temporary folder for one suite's databases. */
export function tempDir(label: string): string {
  return mkdtempSync(path.join(tmpdir(), `pulsewright-${label}-`));
}

/**
 * How to run `file args` without the power to write where file permissions say no, so that
 * taking write permission away from a file binds. Root ignores permissions through the capability
 * CAP_DAC_OVERRIDE, so as root the program runs under util-linux's `setpriv` with that one
 * capability removed (from the bounding and inheritable sets, so the exec cannot get it back).
 * The process is still root and keeps CAP_DAC_READ_SEARCH, so it still reads and traverses every
 * folder: it loads the service wherever the checkout sits, however private its parents are (a
 * clone in a 0700 folder made by `mktemp -d`, a private home folder). That is why this replaced
 * running the service as `nobody`, which cannot reach a checkout in a private folder. Any other
 * user is bound by permissions already and gets `file args` unchanged. No mount, no second user.
 */
export function boundByWritePermissions(
  file: string,
  args: string[],
): { file: string; args: string[] } {
  if (process.getuid?.() !== 0) return { file, args };
  try {
    execFileSync('setpriv', ['--version'], { stdio: 'ignore' });
  } catch {
    throw new Error(
      'Running as root, the tests take write permission away from the service with `setpriv` ' +
        '(util-linux), which is not on PATH: apt-get install -y util-linux.',
    );
  }
  return {
    file: 'setpriv',
    args: ['--inh-caps=-dac_override', '--bounding-set=-dac_override', '--', file, ...args],
  };
}

/** A free loopback port, asked of the OS. */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() =>
        typeof address === 'object' && address
          ? resolve(address.port)
          : reject(new Error('no port')),
      );
    });
  });
}

export interface ChildServer {
  baseUrl: string;
  port: number;
  /** Where the service's local mail transport delivers (MAIL_DIR). */
  mailDir: string;
  child: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far. */
  output: () => string;
  /** Resolves with the exit code (or signal name) once the process has ended. */
  exited: Promise<number | string | null>;
  /** SIGTERM, then SIGKILL after 5 s; resolves when the process is gone. */
  stop(): Promise<void>;
  /** SIGKILL at once (a crash); resolves when the process is gone. */
  kill(): Promise<void>;
}

/**
 * Starts the built API (node apps/api/dist/index.js) on 127.0.0.1 and a free port with the
 * database at `databaseUrl`, and waits for GET /api/health. Builds nothing: `npm test` runs
 * `turbo run build` first.
 */
export async function startChildServer(options: {
  databaseUrl: string;
  env?: Record<string, string>;
  port?: number;
  waitForHealth?: boolean;
  /**
   * Without the power to write where file permissions say no (see `boundByWritePermissions`),
   * so that taking write permission away from its database binds even when the tests run as root.
   */
  boundByWritePermissions?: boolean;
}): Promise<ChildServer> {
  if (!existsSync(apiEntry))
    throw new Error(`${apiEntry} is missing: run \`npm run build\` first.`);
  const port = options.port ?? (await freePort());
  const mailDir = options.env?.MAIL_DIR ?? mailDirBeside(options.databaseUrl);
  let output = '';
  const command = options.boundByWritePermissions
    ? boundByWritePermissions(process.execPath, [apiEntry])
    : { file: process.execPath, args: [apiEntry] };
  const child = spawn(command.file, command.args, {
    cwd: repoRoot,
    env: {
      PATH: process.env.PATH ?? '',
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: options.databaseUrl,
      DEMO_PASSWORD,
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      BCRYPT_ROUNDS: '4',
      LOGIN_RATE_LIMIT: '100000',
      LOGIN_ACCOUNT_RATE_LIMIT: '100000',
      RESET_RATE_LIMIT: '100000',
      RESET_ACCOUNT_RATE_LIMIT: '100000',
      ACCEPT_RATE_LIMIT: '100000',
      KEY_RATE_LIMIT: '100000',
      MAIL_DIR: mailDir,
      SMTP_URL: '',
      SCARF_ANALYTICS: 'false',
      WEB_DIST: path.join(tmpdir(), 'pulsewright-no-web'),
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<number | string | null>((resolve) => {
    child.once('exit', (code, signal) => resolve(code ?? signal));
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  mailDirs.set(baseUrl, mailDir);
  const server: ChildServer = {
    baseUrl,
    port,
    mailDir,
    child,
    output: () => output,
    exited,
    async stop() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
      await exited;
      clearTimeout(timer);
    },
    async kill() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGKILL');
      await exited;
    },
  };
  if (options.waitForHealth === false) return server;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null)
      throw new Error(`The API exited with ${child.exitCode}:\n${output}`);
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      await server.kill();
      throw new Error(`The API did not answer /api/health within 30 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  return server;
}

/** Signs in over HTTP and returns the session token. */
export async function signInOver(
  baseUrl: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<string> {
  const response = await fetch(`${baseUrl}/api/v1/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  const body = (await response.json()) as { token?: string };
  if (response.status !== 200 || !body.token)
    throw new Error(`sign-in of ${email} failed: ${response.status} ${JSON.stringify(body)}`);
  return body.token;
}

/** JSON request over HTTP with a bearer token; returns status, content type and parsed body. */
export async function call(
  baseUrl: string,
  method: string,
  urlPath: string,
  token?: string,
  body?: unknown,
): Promise<{ status: number; type: string; body: unknown }> {
  const response = await fetch(`${baseUrl}${urlPath}`, {
    method,
    headers: {
      ...(token ? { authorization: `Bearer ${token}` } : {}),
      ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
    },
    body: body !== undefined ? JSON.stringify(body) : undefined,
  });
  const type = response.headers.get('content-type') ?? '';
  const text = await response.text();
  let parsed: unknown = text;
  if (/json/.test(type) && text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = text;
    }
  }
  return { status: response.status, type, body: parsed };
}

/** The mail drop of each service started here, by base URL. */
const mailDirs = new Map<string, string>();

/** A `mail` folder beside a SQLite database file (the service's own default), else a new one. */
function mailDirBeside(databaseUrl: string): string {
  const file = databaseUrl.startsWith('sqlite:') ? databaseUrl.slice('sqlite:'.length) : '';
  return file && file !== ':memory:'
    ? path.join(path.dirname(path.resolve(file)), 'mail')
    : path.join(tempDir('mail'), 'mail');
}

/**
 * Messages the service at `baseUrl` delivered to `to`, oldest first, read from its local mail
 * drop: where a one-time link is usable (the outbox masks it). A service started elsewhere
 * (E2E_BASE_URL) is read from MAIL_DIR, else from `data/mail` (the default database's folder).
 */
export function deliveredMail(baseUrl: string, to: string): DeliveredMail[] {
  const dir = mailDirs.get(baseUrl) ?? process.env.MAIL_DIR ?? path.join(repoRoot, 'data', 'mail');
  return readMailDrop(dir).filter((mail) => mail.to === to);
}

/** Waits (up to `timeoutMs`) for a message to `to` whose text matches `pattern`; returns the match. */
export async function waitForDeliveredMail(
  baseUrl: string,
  to: string,
  pattern: RegExp,
  timeoutMs = 10_000,
): Promise<RegExpExecArray> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    for (const mail of deliveredMail(baseUrl, to).reverse()) {
      const match = pattern.exec(mail.text);
      if (match) return match;
    }
    if (Date.now() > deadline)
      throw new Error(`no mail to ${to} matching ${pattern} was delivered within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
