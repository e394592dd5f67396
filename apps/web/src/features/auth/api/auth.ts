import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, unwrapEmpty } from '../../../lib/api';
import { session } from '../../../lib/session';

export type Me = Schema<'Me'>;
export type Role = Schema<'Role'>;

export async function getMe(): Promise<Me> {
  return unwrap(await api.GET('/api/v1/me'));
}

export const meQueryOptions = () => queryOptions({ queryKey: ['me', session.getToken()], queryFn: getMe, staleTime: 60_000, retry: false });

export function useMe(enabled = true) {
  return useQuery({ ...meQueryOptions(), enabled });
}

export async function login(body: { email: string; password: string }) {
  return unwrap(await api.POST('/api/v1/auth/login', { body }));
}

export function useLogin() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ token }) => {
      client.clear();
      session.setToken(token);
    },
  });
}

export async function logout(): Promise<void> {
  unwrapEmpty(await api.POST('/api/v1/auth/logout'));
}

export function useLogout() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: () => {
      session.setToken(null);
      client.clear();
    },
  });
}

export async function requestPasswordReset(body: { email: string }) {
  return unwrap(await api.POST('/api/v1/auth/password-reset', { body }));
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}

export async function confirmPasswordReset(body: { token: string; password: string }) {
  unwrapEmpty(await api.POST('/api/v1/auth/password-reset/confirm', { body }));
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}

export async function acceptInvitation(body: { token: string; name: string; password: string }) {
  return unwrap(await api.POST('/api/v1/invitations/accept', { body }));
}

export function useAcceptInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: ({ token }) => {
      client.clear();
      session.setToken(token);
    },
  });
}

const RANK: Record<Role, number> = { viewer: 0, engineer: 1, admin: 2 };

/** Whether a role reaches another (viewer < engineer < admin), as the API's middleware checks. */
export function roleAtLeast(role: Role | undefined, wanted: Role): boolean {
  return role !== undefined && RANK[role] >= RANK[wanted];
}
