import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ReadOnlyNotice } from './ReadOnlyNotice';
import { RoleGate } from './RoleGate';

const me = (role: string) =>
  new Response(
    JSON.stringify({
      user: { id: '00000000-0000-4000-8000-000000000001', email: 'x@kestrel.example', name: 'X' },
      team: { id: '00000000-0000-4000-8000-000000000002', name: 'Kestrel' },
      role,
    }),
    { status: 200, headers: { 'Content-Type': 'application/json' } },
  );

function Page() {
  return (
    <>
      <ReadOnlyNotice can="you can read this study" needs="Saving needs" />
      <RoleGate role="engineer" otherwise={<span>read only</span>}>
        <button type="button">Save revision</button>
      </RoleGate>
    </>
  );
}

const renderAs = (role: string) => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => me(role)),
  );
  render(
    <QueryClientProvider
      client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}
    >
      <Page />
    </QueryClientProvider>,
  );
};

afterEach(() => vi.unstubAllGlobals());

describe('RoleGate and ReadOnlyNotice', () => {
  it('show a viewer no save control and a banner saying what they can do', async () => {
    renderAs('viewer');
    expect(await screen.findByText('read only')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save revision' })).toBeNull();
    expect(screen.getByRole('note')).toHaveTextContent(
      'You have the viewer role: you can read this study. Saving needs the engineer role',
    );
    expect(screen.getByRole('note')).not.toHaveTextContent(/explore|change the values/);
  });

  it('show an engineer the control and no banner', async () => {
    renderAs('engineer');
    expect(await screen.findByRole('button', { name: 'Save revision' })).toBeInTheDocument();
    expect(screen.queryByRole('note')).toBeNull();
  });
});
