import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import type { ApiKey, Role } from '../../../lib/api';
import { TeamPage } from './TeamPage';

// Issue 10's two rules for the team page: a viewer (who reaches it only by its URL) is shown no
// key form that the service would refuse (POST /api/v1/api-keys needs the engineer role, per
// x-pulsewright-role in apps/api/openapi.yaml), and revoking a key asks first and takes the new
// key's secret off the screen.

const USER = '00000000-0000-4000-8000-000000000001';
const json = (status: number, body?: unknown) =>
  new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });

/** A service with one team, the caller in `role`, and the keys it makes, kept in memory. */
function fakeService(role: Role) {
  const keys: ApiKey[] = [];
  const calls: string[] = [];
  const fetch = vi.fn(async (request: Request) => {
    const { pathname } = new URL(request.url);
    calls.push(`${request.method} ${pathname}`);
    if (pathname === '/api/v1/me')
      return json(200, {
        user: { id: USER, email: 'e@kestrel.example', name: 'E' },
        team: { id: USER, name: 'Kestrel Drives' },
        role,
        authMethod: 'session',
      });
    if (pathname === '/api/v1/api-keys' && request.method === 'GET') return json(200, keys);
    if (pathname === '/api/v1/api-keys' && request.method === 'POST') {
      const body = (await request.json()) as { name: string; role: Role };
      const key: ApiKey = {
        id: `00000000-0000-4000-8000-00000000010${keys.length}`,
        name: body.name,
        prefix: 'pwk_abcd',
        role: body.role,
        userId: USER,
        userEmail: 'e@kestrel.example',
        createdAt: '2026-01-01T00:00:00Z',
        lastUsedAt: null,
        expiresAt: null,
        revokedAt: null,
      };
      keys.push(key);
      return json(201, { ...key, key: 'pwk_abcd_the-secret-shown-once' });
    }
    const revoked = keys.find((k) => pathname === `/api/v1/api-keys/${k.id}`);
    if (revoked && request.method === 'DELETE') {
      revoked.revokedAt = '2026-01-02T00:00:00Z';
      return json(204);
    }
    return json(404, { type: 'about:blank', title: 'Not found', status: 404 });
  });
  vi.stubGlobal('fetch', fetch);
  return { calls };
}

const renderPage = () =>
  render(
    <AppProviders client={createQueryClient()}>
      <TeamPage />
    </AppProviders>,
  );

afterEach(() => vi.unstubAllGlobals());

describe('TeamPage', () => {
  it('tells a viewer what the page needs and shows no key form, asking for no keys', async () => {
    const { calls } = fakeService('viewer');
    renderPage();
    expect(await screen.findByTestId('team-viewer')).toHaveTextContent('engineer role');
    expect(screen.queryByLabelText('Key name')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Create key' })).toBeNull();
    expect(calls).toEqual(['GET /api/v1/me']);
  });

  it('asks before revoking a key, and revoking the new key takes its secret off the screen', async () => {
    const { calls } = fakeService('engineer');
    renderPage();
    await userEvent.type(await screen.findByLabelText('Key name'), 'build server');
    await userEvent.click(screen.getByRole('button', { name: 'Create key' }));
    expect(await screen.findByTestId('new-key')).toHaveTextContent(
      'pwk_abcd_the-secret-shown-once',
    );

    await userEvent.click(await screen.findByRole('button', { name: 'Revoke build server' }));
    expect(calls.filter((c) => c.startsWith('DELETE'))).toEqual([]);
    await userEvent.click(screen.getByRole('button', { name: 'Keep' }));
    expect(screen.getByTestId('new-key')).toBeInTheDocument();

    await userEvent.click(screen.getByRole('button', { name: 'Revoke build server' }));
    await userEvent.click(screen.getByRole('button', { name: 'Confirm revoking build server' }));
    const row = await screen.findByText(/revoked/);
    expect(within(row.closest('tr') as HTMLElement).getByText('build server')).toBeInTheDocument();
    expect(calls.filter((c) => c.startsWith('DELETE'))).toHaveLength(1);
    expect(screen.queryByTestId('new-key')).toBeNull();
  });

  it('offers an engineer roles up to their own only', async () => {
    fakeService('engineer');
    renderPage();
    const role = await screen.findByLabelText('Role');
    expect(
      within(role)
        .getAllByRole('option')
        .map((o) => o.getAttribute('value')),
    ).toEqual(['viewer', 'engineer']);
    expect(screen.queryByRole('tab', { name: 'Members' })).toBeNull();
  });
});
