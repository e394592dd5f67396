import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, unwrapEmpty, type BodyOf } from './client';
import type { Role } from './me';
import { queryKeys } from './queryKeys';

// The team: members and invitations (admins), API keys (engineers: their own; admins: all), the
// audit log and the mail outbox (admins).

export type Member = Schema<'Member'>;
export type Invitation = Schema<'Invitation'>;
export type ApiKey = Schema<'ApiKey'>;
export type ApiKeyCreated = Schema<'ApiKeyCreated'>;
export type AuditEvent = Schema<'AuditEvent'>;
export type OutboxMessage = Schema<'OutboxMessage'>;

// Members -----------------------------------------------------------------------------------

export async function getMembers(): Promise<Member[]> {
  return unwrap(await api.GET('/api/v1/members'));
}
export const membersQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.team.members, queryFn: getMembers });
export function useMembers() {
  return useQuery(membersQueryOptions());
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
    onSettled: () => client.invalidateQueries({ queryKey: queryKeys.team.all }),
  });
}

export async function removeMember(id: string): Promise<void> {
  unwrapEmpty(await api.DELETE('/api/v1/members/{id}', { params: { path: { id } } }));
}
export function useRemoveMember() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSettled: () => client.invalidateQueries({ queryKey: queryKeys.team.all }),
  });
}

// Invitations -------------------------------------------------------------------------------

export async function getInvitations(): Promise<Invitation[]> {
  return unwrap(await api.GET('/api/v1/invitations'));
}
export const invitationsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.team.invitations, queryFn: getInvitations });
export function useInvitations() {
  return useQuery(invitationsQueryOptions());
}

export async function createInvitation(body: BodyOf<'createInvitation'>): Promise<Invitation> {
  return unwrap(await api.POST('/api/v1/invitations', { body }));
}
export function useCreateInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.team.all }),
  });
}

export async function revokeInvitation(id: string): Promise<void> {
  unwrapEmpty(await api.DELETE('/api/v1/invitations/{id}', { params: { path: { id } } }));
}
export function useRevokeInvitation() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSettled: () => client.invalidateQueries({ queryKey: queryKeys.team.all }),
  });
}

// API keys ----------------------------------------------------------------------------------

export async function getApiKeys(): Promise<ApiKey[]> {
  return unwrap(await api.GET('/api/v1/api-keys'));
}
export const apiKeysQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.team.apiKeys, queryFn: getApiKeys });
export function useApiKeys() {
  return useQuery(apiKeysQueryOptions());
}

export async function createApiKey(body: BodyOf<'createApiKey'>): Promise<ApiKeyCreated> {
  return unwrap(await api.POST('/api/v1/api-keys', { body }));
}
export function useCreateApiKey() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createApiKey,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.team.apiKeys }),
  });
}

export async function revokeApiKey(id: string): Promise<void> {
  unwrapEmpty(await api.DELETE('/api/v1/api-keys/{id}', { params: { path: { id } } }));
}
export function useRevokeApiKey() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: revokeApiKey,
    onSettled: () => client.invalidateQueries({ queryKey: queryKeys.team.apiKeys }),
  });
}

// Audit log and outbox ----------------------------------------------------------------------

export async function getAuditEvents(): Promise<AuditEvent[]> {
  return unwrap(await api.GET('/api/v1/audit-events', { params: { query: { limit: 100 } } }));
}
export const auditEventsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.team.audit, queryFn: getAuditEvents });
export function useAuditEvents() {
  return useQuery(auditEventsQueryOptions());
}

export async function getOutbox(): Promise<OutboxMessage[]> {
  return unwrap(await api.GET('/api/v1/outbox', { params: { query: { limit: 50 } } }));
}
export const outboxQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.team.outbox, queryFn: getOutbox });
export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
