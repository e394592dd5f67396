import type { Problem } from './problem.js';

/** SQLite / PostgreSQL error codes meaning the storage cannot take the write. */
const STORAGE_PROBLEMS: Record<string, string> = {
  SQLITE_READONLY:
    'The database is read-only; nothing was saved. Give the service write access to its database file and folder, then try again.',
  SQLITE_CANTOPEN:
    'The database file cannot be opened for writing; nothing was saved. Check that the file and its folder exist and the service may write them, then try again.',
  SQLITE_IOERR:
    'The database storage failed to read or write (I/O error); nothing was saved. Check the disk that holds the database, then try again.',
  SQLITE_FULL:
    'The database disk is full; nothing was saved. Free space on the storage that holds the database, then try again.',
  SQLITE_BUSY: 'The database is busy with other writes; nothing was saved. Try again in a moment.',
  SQLITE_LOCKED:
    'The database is busy with other writes; nothing was saved. Try again in a moment.',
  // PostgreSQL SQLSTATEs: read_only_sql_transaction, disk_full, insufficient_resources.
  '25006': 'The database is read-only; nothing was saved. Try again once it accepts writes.',
  '53100':
    'The database disk is full; nothing was saved. Free space on the database server, then try again.',
  '53000': 'The database has run out of resources; nothing was saved. Try again in a moment.',
};

/** The driver's error code of a Sequelize error (its `parent` / `original`, or the error itself). */
function driverCode(err: Error): string | undefined {
  const seen = new Set<unknown>();
  let current: unknown = err;
  while (current && typeof current === 'object' && !seen.has(current)) {
    seen.add(current);
    const e = current as {
      code?: unknown;
      message?: unknown;
      parent?: unknown;
      original?: unknown;
      cause?: unknown;
    };
    if (typeof e.code === 'string' && e.code in STORAGE_PROBLEMS) return e.code;
    const named =
      typeof e.message === 'string' ? /\b(SQLITE_[A-Z]+)\b/.exec(e.message)?.[1] : undefined;
    if (named && named in STORAGE_PROBLEMS) return named;
    current = e.parent ?? e.original ?? e.cause;
  }
  return undefined;
}

/**
 * Sequelize's errors: storage that cannot take a write → 503 (RFC 9110 §15.6.4: the service is
 * temporarily unable); a unique constraint broken by a concurrent write → 409. Any other storage
 * error is a bug and falls through to a 500.
 */
export function storageProblem(err: unknown): Problem | undefined {
  if (!(err instanceof Error) || !err.name.startsWith('Sequelize')) return undefined;
  const code = driverCode(err);
  if (code) return { status: 503, detail: STORAGE_PROBLEMS[code] as string, errors: [] };
  if (err.name === 'SequelizeUniqueConstraintError') {
    return {
      status: 409,
      detail: 'That conflicts with data saved meanwhile; reload and try again.',
      errors: [],
    };
  }
  return undefined;
}
