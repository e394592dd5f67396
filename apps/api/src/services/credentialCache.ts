import type { Principal } from './principal.js';

interface Entry {
  principal: Principal;
  /** The credential epoch read before the lookup that verified it. */
  epoch: number;
  /** When the credential (or, for a key, the first key of its lineage) expires, ms; Infinity for never. */
  expiresAt: number;
  /** When the credential's `lastUsedAt` was last written, ms. */
  touchedAt: number;
}

/**
 * Verified bearer credentials of this process, by token hash: a hit skips the session or key,
 * lineage and membership lookups. An entry is good only while the credential epoch is the one
 * read before its lookup (services/credentialEpoch.ts) and its expiry has not passed. Bounded:
 * past `capacity` entries the oldest is dropped.
 */
export class CredentialCache {
  private readonly entries = new Map<string, Entry>();

  constructor(private readonly capacity = 10_000) {}

  /** The cached principal, or undefined when there is none or it is stale at `epoch` and `now`. */
  get(tokenHash: string, epoch: number, now: number): Entry | undefined {
    const entry = this.entries.get(tokenHash);
    if (!entry) return undefined;
    if (entry.epoch !== epoch || entry.expiresAt <= now) {
      this.entries.delete(tokenHash);
      return undefined;
    }
    return entry;
  }

  set(tokenHash: string, entry: Entry): void {
    this.entries.delete(tokenHash);
    this.entries.set(tokenHash, entry);
    if (this.entries.size > this.capacity) {
      const oldest = this.entries.keys().next().value as string;
      this.entries.delete(oldest);
    }
  }
}
