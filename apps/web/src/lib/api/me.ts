import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { session } from '../session';
import { api, unwrap } from './client';
import { queryKeys } from './queryKeys';

// Who is signed in, with their team and role (GET /api/v1/me).

export type Me = Schema<'Me'>;
export type Role = Schema<'Role'>;

export async function getMe(): Promise<Me> {
  return unwrap(await api.GET('/api/v1/me'));
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.me(session.getToken()),
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
