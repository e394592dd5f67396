import { useSyncExternalStore } from 'react';
import { session } from '../lib/session';

/** The current session token, re-rendering on sign-in and sign-out. */
export function useSessionToken(): string | null {
  return useSyncExternalStore(session.subscribe, session.getToken, session.getToken);
}
