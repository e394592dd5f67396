import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';

/** Runs one query on a SQLite file with the sqlite3 package (its own connection) and returns the rows. */
export function queryFile<T = Record<string, unknown>>(file: string, sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READWRITE, (openError) => {
      if (openError) {
        reject(openError);
        return;
      }
      db.all(sql, (error, rows) => {
        db.close(() => (error ? reject(error) : resolve(rows as T[])));
      });
    });
  });
}

/** `PRAGMA integrity_check` of a SQLite file: ['ok'] when the file is sound. */
export async function integrityCheck(file: string): Promise<string[]> {
  const rows = await queryFile<{ integrity_check: string }>(file, 'PRAGMA integrity_check');
  return rows.map((r) => r.integrity_check);
}

/**
 * A small tmpfs of its own (needs root, which these suites run as): the only honest way to give
 * SQLite a disk that fills up or turns read-only under a running service.
 */
export interface SmallDisk {
  dir: string;
  readOnly(): void;
  readWrite(): void;
  dispose(): void;
}

export function mountSmallDisk(sizeBytes: number): SmallDisk {
  const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-disk-'));
  try {
    execFileSync('mount', ['-t', 'tmpfs', '-o', `size=${sizeBytes}`, 'tmpfs', dir]);
  } catch (error) {
    rmdirSync(dir);
    throw new Error(
      `The fault suite mounts a small tmpfs and needs root for it: ${(error as Error).message}`,
    );
  }
  return {
    dir,
    readOnly: () => execFileSync('mount', ['-o', 'remount,ro', dir]),
    readWrite: () => execFileSync('mount', ['-o', 'remount,rw', dir]),
    dispose: () => {
      execFileSync('umount', ['-l', dir]);
      rmdirSync(dir);
    },
  };
}
