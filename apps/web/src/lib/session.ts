/**
 * The session token: kept in memory and mirrored to sessionStorage so a reload keeps the
 * sign-in while closing the tab ends it. Listeners hear sign-in and sign-out.
 */
const STORAGE_KEY = 'pulsewright.session';

type Listener = (token: string | null) => void;

function readStored(): string | null {
  try {
    return globalThis.sessionStorage?.getItem(STORAGE_KEY) ?? null;
  } catch {
    return null;
  }
}

let current: string | null = readStored();
const listeners = new Set<Listener>();

export const session = {
  // Arrow functions: React's useSyncExternalStore and callers take them off the object.
  getToken: (): string | null => current,
  setToken: (token: string | null): void => {
    current = token;
    try {
      if (token) globalThis.sessionStorage?.setItem(STORAGE_KEY, token);
      else globalThis.sessionStorage?.removeItem(STORAGE_KEY);
    } catch {
      // Storage may be unavailable (private mode); the in-memory token still works.
    }
    listeners.forEach((listener) => listener(token));
  },
  subscribe: (listener: Listener): (() => void) => {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
};
