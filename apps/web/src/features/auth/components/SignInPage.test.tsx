import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { session } from '../../../lib/session';
import { SignInPage } from './SignInPage';

function renderPage() {
  const router = createMemoryRouter(
    [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/studies', element: <p>studies page</p> },
    ],
    { initialEntries: ['/sign-in'] },
  );
  return render(
    <AppProviders client={createQueryClient()}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
}

const json = (status: number, body: unknown, type = 'application/json') =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': type } });

afterEach(() => {
  vi.unstubAllGlobals();
  session.setToken(null);
});

describe('SignInPage', () => {
  it('shows the server field error beside the e-mail field', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        json(
          400,
          {
            type: 'x',
            title: 'Bad request',
            status: 400,
            detail: 'email is not an e-mail address',
            errors: [{ path: '/body/email', message: 'email must be an e-mail address' }],
          },
          'application/problem+json',
        ),
      ),
    );
    renderPage();
    await userEvent.type(screen.getByLabelText('E-mail'), 'nobody');
    await userEvent.type(screen.getByLabelText('Password'), 'x');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('email must be an e-mail address')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
  });

  it('keeps the token and moves on after a good sign-in, with the keyboard only', async () => {
    const fetch = vi.fn(async () =>
      json(200, { token: 'pws_test_token', expiresAt: '2030-01-01T00:00:00Z' }),
    );
    vi.stubGlobal('fetch', fetch);
    renderPage();
    await userEvent.tab();
    await userEvent.keyboard('engineer@kestrel.example');
    await userEvent.tab();
    await userEvent.keyboard('pulsewright-demo{Enter}');
    expect(await screen.findByText('studies page')).toBeInTheDocument();
    expect(session.getToken()).toBe('pws_test_token');
    const request = fetch.mock.calls[0] as unknown as [Request];
    expect(request[0].url).toMatch(/\/api\/v1\/auth\/login$/);
  });
});
