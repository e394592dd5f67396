import { execFileSync } from 'node:child_process';
import {
  chmodSync,
  closeSync,
  openSync,
  readdirSync,
  rmSync,
  statfsSync,
  writeSync,
} from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import {
  boundByWritePermissions,
  call,
  DEMO,
  signInOver,
  startChildServer,
  tempDir,
  type ChildServer,
} from '../support/server.js';
import { integrityCheck, mountSmallDisk, queryFile, type SmallDisk } from './support/sqlite.js';

/**
 * Faults: the built service (node apps/api/dist/index.js) as a child process on 127.0.0.1, killed
 * with SIGKILL in the middle of a burst of writes, restarted on the same file; and a database
 * whose disk turns read-only or fills up while the service runs. After each, SQLite's own
 * `PRAGMA integrity_check` must say ok and every write the service acknowledged must be there.
 * The expected answer for storage it cannot write is 503 with a message saying so (RFC 9110
 * §15.6.4: the server is temporarily unable to handle the request).
 */

/** The same bridge as a stored study's design (the design supplies vdc and the carrier frequency). */
const DESIGN = {
  vdc: 375,
  fundamentalFrequency: 50,
  carrierFrequency: 41 * 50,
  modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.86 },
};

const cleanups: (() => Promise<void> | void)[] = [];
afterEach(async () => {
  for (const cleanup of cleanups.splice(0).reverse()) {
    try {
      await cleanup();
    } catch {
      // keep cleaning up
    }
  }
});

async function start(databaseFile: string): Promise<ChildServer> {
  const server = await startChildServer({ databaseUrl: `sqlite:${databaseFile}` });
  cleanups.push(() => server.kill());
  return server;
}

interface Acknowledged {
  id: string;
  name: string;
}

/** Creates studies from `lanes` concurrent loops until `stop()` resolves; returns the acknowledged ones. */
async function studyBurst(
  server: ChildServer,
  token: string,
  projectId: string,
  lanes: number,
  stop: Promise<void>,
) {
  const acknowledged: Acknowledged[] = [];
  let stopped = false;
  let counter = 0;
  let refused = 0;
  void stop.then(() => (stopped = true));
  const lane = async () => {
    while (!stopped) {
      const name = `burst study ${++counter}`;
      try {
        const res = await call(server.baseUrl, 'POST', '/api/v1/studies', token, {
          projectId,
          name,
          design: DESIGN,
          note: 'x'.repeat(500),
        });
        if (res.status === 201) acknowledged.push({ id: (res.body as { id: string }).id, name });
        else refused++;
      } catch {
        // the connection died with the process: not acknowledged
      }
    }
  };
  await Promise.all(Array.from({ length: lanes }, lane));
  return { acknowledged, refused, sent: counter };
}

/**
 * Whether a process started like the service in the read-only test can open `file` for writing:
 * true, false on a permission error (EACCES, EPERM, EROFS), an exception on anything else.
 */
function writableByTheService(file: string): boolean {
  const probe = boundByWritePermissions(process.execPath, [
    '-e',
    `try { require('node:fs').closeSync(require('node:fs').openSync(process.argv[1], 'r+')); }
     catch (e) { if (['EACCES', 'EPERM', 'EROFS'].includes(e.code)) process.exit(3); throw e; }`,
    file,
  ]);
  try {
    execFileSync(probe.file, probe.args, { stdio: ['ignore', 'ignore', 'pipe'] });
    return true;
  } catch (error) {
    if ((error as { status?: number }).status === 3) return false;
    throw error;
  }
}

async function newProject(server: ChildServer, token: string): Promise<string> {
  const res = await call(server.baseUrl, 'POST', '/api/v1/projects', token, { name: 'Fault run' });
  expect(res.status).toBe(201);
  return (res.body as { id: string }).id;
}

async function missingStudies(
  server: ChildServer,
  token: string,
  studies: Acknowledged[],
): Promise<string[]> {
  const missing: string[] = [];
  for (const study of studies) {
    const res = await call(server.baseUrl, 'GET', `/api/v1/studies/${study.id}`, token);
    if (res.status !== 200 || (res.body as { name: string }).name !== study.name)
      missing.push(study.id);
  }
  return missing;
}

describe('faults', () => {
  it('SIGKILL during a burst of study writes: integrity_check ok, every acknowledged study there after restart', async () => {
    const dir = tempDir('faults-kill');
    cleanups.push(() => rmSync(dir, { recursive: true, force: true }));
    const file = path.join(dir, 'kill.sqlite');
    const first = await start(file);
    const token = await signInOver(first.baseUrl, DEMO.admin);
    const projectId = await newProject(first, token);
    // Four lanes: enough to keep writes in flight at the kill without the 50-connection pile-up
    // the load suite measures.
    let kill!: () => void;
    const killed = new Promise<void>((resolve) => (kill = resolve));
    const burst = studyBurst(first, token, projectId, 4, killed);
    await new Promise((r) => setTimeout(r, 1500));
    await first.kill();
    kill();
    const { acknowledged, sent } = await burst;
    expect(first.child.signalCode).toBe('SIGKILL');
    expect(acknowledged.length).toBeGreaterThan(10);
    expect(sent).toBeGreaterThan(acknowledged.length - 1);

    expect(await integrityCheck(file)).toEqual(['ok']);
    expect(await queryFile(file, 'PRAGMA foreign_key_check')).toEqual([]);

    const second = await start(file);
    const token2 = await signInOver(second.baseUrl, DEMO.admin);
    expect(await missingStudies(second, token2, acknowledged)).toEqual([]);
    console.log(
      `faults: SIGKILL after ${sent} study writes sent, ${acknowledged.length} acknowledged, all ${acknowledged.length} present after restart, integrity_check ok`,
    );
  }, 60_000);

  it('a job running when the service is killed ends as failed after the restart, never stays running', async () => {
    const dir = tempDir('faults-job');
    cleanups.push(() => rmSync(dir, { recursive: true, force: true }));
    const file = path.join(dir, 'job.sqlite');
    const first = await start(file);
    const token = await signInOver(first.baseUrl, DEMO.admin);
    const started = await call(first.baseUrl, 'POST', '/api/v1/jobs/ma-sweeps', token, {
      modulation: { method: 'three-phase', ma: 0.9, mf: 999, vdc: 650, zeroSequence: 'min-max' },
      ma: { from: 0.05, to: 1.15, points: 400 },
      maxOrder: 2000,
    });
    expect(started.status).toBe(202);
    const job = started.body as { id: string; status: string };
    const before = await call(first.baseUrl, 'GET', `/api/v1/jobs/${job.id}`, token);
    expect(
      (before.body as { status: string }).status,
      'the sweep must still be running when the service is killed',
    ).toBe('running');
    await first.kill();

    const second = await start(file);
    const token2 = await signInOver(second.baseUrl, DEMO.admin);
    const after = await call(second.baseUrl, 'GET', `/api/v1/jobs/${job.id}`, token2);
    expect(after.status).toBe(200);
    const body = after.body as { status: string; error: string | null; finishedAt: string | null };
    expect(body.status).toBe('failed');
    expect(body.error).toMatch(/stopped|restart|interrupted/i);
    expect(body.finishedAt).not.toBeNull();
    expect(await integrityCheck(file)).toEqual(['ok']);
  }, 60_000);

  describe('storage it cannot write', () => {
    let disk: SmallDisk | undefined;
    afterEach(() => {
      try {
        disk?.readWrite();
      } catch {
        // already read-write
      }
      disk?.dispose();
      disk = undefined;
    });

    it('a read-only database file: writes answer 503 with a clear message, reads go on, nothing is corrupted', async () => {
      // The service runs without the power to override file permissions (as root: without
      // CAP_DAC_OVERRIDE, see boundByWritePermissions), so taking write permission away from its
      // files binds (root ignores permissions; a busy tmpfs cannot be remounted read-only under
      // open files). It still reads everything, so it starts from a checkout in any folder, a
      // private one included. Each write transaction opens a new SQLite connection, which finds
      // the file read-only.
      const dir = tempDir('faults-ro');
      cleanups.push(() => rmSync(dir, { recursive: true, force: true }));
      const file = path.join(dir, 'ro.sqlite');
      const server = await startChildServer({
        databaseUrl: `sqlite:${file}`,
        boundByWritePermissions: true,
      });
      cleanups.push(() => server.kill());
      const token = await signInOver(server.baseUrl, DEMO.admin);
      const projectId = await newProject(server, token);
      const before = await call(server.baseUrl, 'POST', '/api/v1/studies', token, {
        projectId,
        name: 'before read-only',
        design: DESIGN,
      });
      expect(before.status).toBe(201);

      const files = readdirSync(dir).map((f) => path.join(dir, f));
      for (const f of files) chmodSync(f, 0o444);
      chmodSync(dir, 0o555);
      cleanups.push(() => chmodSync(dir, 0o755));
      // The premise, checked apart from the service: a process started the way the service was
      // cannot open the file for writing. Otherwise a 201 below would be the test's fault.
      expect(writableByTheService(file), `${file} is still writable for the service`).toBe(false);
      const refused = await call(server.baseUrl, 'POST', '/api/v1/studies', token, {
        projectId,
        name: 'during read-only',
        design: DESIGN,
      });
      const read = await call(
        server.baseUrl,
        'GET',
        `/api/v1/studies/${(before.body as { id: string }).id}`,
        token,
      );
      chmodSync(dir, 0o755);
      for (const f of files) chmodSync(f, 0o644);

      expect.soft(read.status, 'reads while the file is read-only').toBe(200);
      expect.soft(refused.type).toMatch(/^application\/problem\+json/);
      expect
        .soft({ status: refused.status, detail: (refused.body as { detail?: string }).detail })
        .toMatchObject({
          status: 503,
          detail: expect.stringMatching(/read-only|read only|cannot (be )?writ|storage/i),
        });
      await server.stop();
      expect(await integrityCheck(file)).toEqual(['ok']);
      const again = await startChildServer({
        databaseUrl: `sqlite:${file}`,
        boundByWritePermissions: true,
      });
      cleanups.push(() => again.kill());
      const token2 = await signInOver(again.baseUrl, DEMO.admin);
      expect(
        await missingStudies(again, token2, [
          { id: (before.body as { id: string }).id, name: 'before read-only' },
        ]),
      ).toEqual([]);
      const after = await call(again.baseUrl, 'POST', '/api/v1/studies', token2, {
        projectId,
        name: 'after read-only',
        design: DESIGN,
      });
      expect(after.status).toBe(201);
      console.log(
        `faults: read-only file; write answered ${refused.status}: ${(refused.body as { detail?: string }).detail} (service log: ${server.output().match(/SQLITE_\w+[^\n]*/)?.[0] ?? 'no SQLite error'})`,
      );
    }, 60_000);

    it('a full disk: writes answer 503 with a clear message, acknowledged writes and the file survive', async () => {
      disk = mountSmallDisk(24 * 1024 * 1024);
      const file = path.join(disk.dir, 'full.sqlite');
      const server = await start(file);
      const token = await signInOver(server.baseUrl, DEMO.admin);
      const projectId = await newProject(server, token);
      // Fill what is left of the disk, keeping a few pages so the service still starts requests.
      const filler = path.join(disk.dir, 'filler.bin');
      const fd = openSync(filler, 'w');
      const chunk = Buffer.alloc(64 * 1024, 1);
      try {
        for (;;) {
          const { bavail, bsize } = statfsSync(disk.dir);
          if (bavail * bsize <= 64 * 1024) break;
          writeSync(fd, chunk);
        }
      } catch {
        // ENOSPC: full
      } finally {
        closeSync(fd);
      }
      const acknowledged: Acknowledged[] = [];
      let refusal: { status: number; type: string; body: unknown } | undefined;
      for (let i = 0; i < 400 && !refusal; i++) {
        const name = `filling ${i}`;
        const res = await call(server.baseUrl, 'POST', '/api/v1/studies', token, {
          projectId,
          name,
          design: DESIGN,
          note: 'n'.repeat(2000),
        });
        if (res.status === 201) acknowledged.push({ id: (res.body as { id: string }).id, name });
        else refusal = res;
      }
      expect(refusal, 'the disk never filled').toBeDefined();
      rmSync(filler);
      const detail = (refusal?.body as { detail?: string } | undefined)?.detail;
      expect.soft(refusal?.type).toMatch(/^application\/problem\+json/);
      expect
        .soft({ status: refusal?.status, detail })
        .toMatchObject({ status: 503, detail: expect.stringMatching(/full|space|storage/i) });
      // With room again the same process writes again, and nothing acknowledged was lost.
      const after = await call(server.baseUrl, 'POST', '/api/v1/studies', token, {
        projectId,
        name: 'after the disk was freed',
        design: DESIGN,
      });
      expect.soft(after.status, 'a write once there is room again').toBe(201);
      expect(await missingStudies(server, token, acknowledged)).toEqual([]);
      await server.stop();
      expect(await integrityCheck(file)).toEqual(['ok']);
      console.log(
        `faults: full disk after ${acknowledged.length} acknowledged writes; refusal ${refusal?.status}: ${detail} (service log: ${server.output().match(/SQLITE_\w+[^\n]*/)?.[0] ?? 'no SQLite error'})`,
      );
    }, 90_000);
  });
});
