import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository root (tests/support → two levels up). */
export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const apiEntry = path.join(repoRoot, 'apps', 'api', 'dist', 'index.js');
export const DEMO_PASSWORD = 'pulsewright-demo';
export const DEMO = {
  admin: 'admin@kestrel.example',
  engineer: 'engineer@kestrel.example',
  viewer: 'viewer@kestrel.example',
} as const;

/** A new temporary folder for one suite's databases. */
export function tempDir(label: string): string {
  return mkdtempSync(path.join(tmpdir(), `pulsewright-${label}-`));
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
  child: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far. */
  output(): string;
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
  /** Run as this user id (and group id), e.g. 65534 (nobody), so file permissions apply. */
  uid?: number;
}): Promise<ChildServer> {
  if (!existsSync(apiEntry))
    throw new Error(`${apiEntry} is missing: run \`npm run build\` first.`);
  const port = options.port ?? (await freePort());
  let output = '';
  const child = spawn(process.execPath, [apiEntry], {
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
      KEY_RATE_LIMIT: '100000',
      SMTP_URL: '',
      SCARF_ANALYTICS: 'false',
      WEB_DIST: path.join(tmpdir(), 'pulsewright-no-web'),
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
    ...(options.uid !== undefined ? { uid: options.uid, gid: options.uid } : {}),
  });
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<number | string | null>((resolve) => {
    child.once('exit', (code, signal) => resolve(code ?? signal));
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  const server: ChildServer = {
    baseUrl,
    port,
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
