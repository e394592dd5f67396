import { useMutation, useQueryClient } from '@tanstack/react-query';
import { session } from '../session';
import { api, unwrap, unwrapEmpty, type BodyOf } from './client';

// Sign-in, sign-out, password reset and invitations: mutations only. A new session starts with
// an empty cache, so nothing read under the previous one is shown.

export async function login(body: BodyOf<'login'>) {
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

export async function requestPasswordReset(body: BodyOf<'requestPasswordReset'>) {
  return unwrap(await api.POST('/api/v1/auth/password-reset', { body }));
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}

export async function confirmPasswordReset(body: BodyOf<'confirmPasswordReset'>) {
  unwrapEmpty(await api.POST('/api/v1/auth/password-reset/confirm', { body }));
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}

export async function acceptInvitation(body: BodyOf<'acceptInvitation'>) {
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
