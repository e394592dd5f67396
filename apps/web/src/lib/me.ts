import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from './api';
import { session } from './session';

// Who is signed in: shared by every feature (features never import each other).

export type Me = Schema<'Me'>;
export type Role = Schema<'Role'>;

export async function getMe(): Promise<Me> {
  return unwrap(await api.GET('/api/v1/me'));
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: ['me', session.getToken()],
    queryFn: getMe,
    staleTime: 60_000,
    retry: false,
  });

export function useMe(enabled = true) {
  return useQuery({ ...meQueryOptions(), enabled });
}

const RANK: Record<Role, number> = { viewer: 0, engineer: 1, admin: 2 };

/** Whether a role reaches another (viewer < engineer < admin), as the API's middleware checks. */
export function roleAtLeast(role: Role | undefined, wanted: Role): boolean {
  return role !== undefined && RANK[role] >= RANK[wanted];
}
