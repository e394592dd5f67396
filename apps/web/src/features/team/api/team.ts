import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, unwrapEmpty } from '../../../lib/api';

export type Member = Schema<'Member'>;
export type Invitation = Schema<'Invitation'>;
export type ApiKey = Schema<'ApiKey'>;
export type ApiKeyCreated = Schema<'ApiKeyCreated'>;
export type Role = Schema<'Role'>;

// Members
export async function getMembers(): Promise<Member[]> {
  return unwrap(await api.GET('/api/v1/members'));
}
export const membersQueryOptions = () =>
  queryOptions({ queryKey: ['team', 'members'], queryFn: getMembers });
export function useMembers(enabled: boolean) {
  return useQuery({ ...membersQueryOptions(), enabled });
}
export async function updateMember({ id, role }: { id: string; role: Role }): Promise<Member> {
  return unwrap(
    await api.PATCH('/api/v1/members/{id}', { params: { path: { id } }, body: { role } }),
  );
}
export function useUpdateMember() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSettled: () => client.invalidateQueries({ queryKey: ['team'] }),
  });
}
export async function removeMember(id: string): Promise<void> {
  unwrapEmpty(await api.DELETE('/api/v1/members/{id}', { params: { path: { id } } }));
}
export function useRemoveMember() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSettled: () => client.invalidateQueries({ queryKey: ['team'] }),
  });
}

// Invitations
export async function getInvitations(): Promise<Invitation[]> {
  return unwrap(await api.GET('/api/v1/invitations'));
}
export const invitationsQueryOptions = () =>
  queryOptions({ queryKey: ['team', 'invitations'], queryFn: getInvitations });
export function useInvitations(enabled: boolean) {
  return useQuery({ ...invitationsQueryOptions(), enabled });
}
export async function createInvitation(body: { email: string; role: Role }): Promise<Invitation> {
  return unwrap(await api.POST('/api/v1/invitations', { body }));
}
export function useCreateInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => client.invalidateQueries({ queryKey: ['team'] }),
  });
}
export async function revokeInvitation(id: string): Promise<void> {
  unwrapEmpty(await api.DELETE('/api/v1/invitations/{id}', { params: { path: { id } } }));
}
export function useRevokeInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSettled: () => client.invalidateQueries({ queryKey: ['team'] }),
  });
}

// API keys
export async function getApiKeys(): Promise<ApiKey[]> {
  return unwrap(await api.GET('/api/v1/api-keys'));
}
export const apiKeysQueryOptions = () =>
  queryOptions({ queryKey: ['team', 'api-keys'], queryFn: getApiKeys });
export function useApiKeys(enabled: boolean) {
  return useQuery({ ...apiKeysQueryOptions(), enabled });
}
export async function createApiKey(body: {
  name: string;
  role: Role;
  expiresInDays?: number;
}): Promise<ApiKeyCreated> {
  return unwrap(await api.POST('/api/v1/api-keys', { body }));
}
export function useCreateApiKey() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createApiKey,
    onSuccess: () => client.invalidateQueries({ queryKey: ['team', 'api-keys'] }),
  });
}
export async function revokeApiKey(id: string): Promise<void> {
  unwrapEmpty(await api.DELETE('/api/v1/api-keys/{id}', { params: { path: { id } } }));
}
export function useRevokeApiKey() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: revokeApiKey,
    onSettled: () => client.invalidateQueries({ queryKey: ['team', 'api-keys'] }),
  });
}

// Audit log and outbox
export async function getAuditEvents(): Promise<Schema<'AuditEvent'>[]> {
  return unwrap(await api.GET('/api/v1/audit-events', { params: { query: { limit: 100 } } }));
}
export const auditQueryOptions = () =>
  queryOptions({ queryKey: ['team', 'audit'], queryFn: getAuditEvents });
export function useAuditEvents(enabled: boolean) {
  return useQuery({ ...auditQueryOptions(), enabled });
}
export async function getOutbox(): Promise<Schema<'OutboxMessage'>[]> {
  return unwrap(await api.GET('/api/v1/outbox', { params: { query: { limit: 50 } } }));
}
export const outboxQueryOptions = () =>
  queryOptions({ queryKey: ['team', 'outbox'], queryFn: getOutbox });
export function useOutbox(enabled: boolean) {
  return useQuery({ ...outboxQueryOptions(), enabled });
}
