import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { CapturesPage } from './CapturesPage';

const ID = '00000000-0000-4000-8000-0000000000c1';
const json = (body: unknown) =>
  new Response(JSON.stringify(body), {
    status: 200,
    headers: { 'Content-Type': 'application/json' },
  });

/** A service with one stored capture and the caller in `role` (the role rule is x-pulsewright-role of POST /api/v1/captures in apps/api/openapi.yaml). */
function stubService(role: 'viewer' | 'engineer') {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (request: Request) => {
      const { pathname } = new URL(request.url);
      if (pathname === '/api/v1/me')
        return json({
          user: { id: ID, email: 'e@kestrel.example', name: 'E' },
          team: { id: ID, name: 'Kestrel Drives' },
          role,
        });
      if (pathname === '/api/v1/captures')
        return json([
          {
            id: ID,
            name: 'Bench run 1',
            rows: 2000,
            sampleRate: 100_000,
            createdAt: '2026-01-01T00:00:00Z',
          },
        ]);
      // The capture itself stays pending: this checks the page's parts, not the analysis.
      return new Promise<Response>(() => undefined);
    }),
  );
}

afterEach(() => vi.unstubAllGlobals());

describe('CapturesPage', () => {
  it('shows the upload form to an engineer and marks the capture picked from the list', async () => {
    stubService('engineer');
    render(
      <AppProviders client={createQueryClient()}>
        <CapturesPage />
      </AppProviders>,
    );
    expect(await screen.findByLabelText(/CSV file/)).toBeInTheDocument();
    expect(screen.getByLabelText('Name')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Upload' })).toBeDisabled();
    const pick = await screen.findByRole('button', { name: /Bench run 1/ });
    expect(pick).toHaveAttribute('aria-pressed', 'false');
    fireEvent.click(pick);
    expect(pick).toHaveAttribute('aria-pressed', 'true');
    expect(await screen.findByText('Loading the capture…')).toBeInTheDocument();
  });

  it('tells a viewer that uploading needs the engineer role', async () => {
    stubService('viewer');
    render(
      <AppProviders client={createQueryClient()}>
        <CapturesPage />
      </AppProviders>,
    );
    expect(await screen.findByText('Uploading needs the engineer role.')).toBeInTheDocument();
    expect(screen.queryByLabelText(/CSV file/)).not.toBeInTheDocument();
  });
});
