import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, unwrap, unwrapEmpty } from '../../../lib/api';
import { session } from '../../../lib/session';

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
