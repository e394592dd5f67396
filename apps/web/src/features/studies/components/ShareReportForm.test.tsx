import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { ShareReportForm } from './ShareReportForm';

const STUDY = '00000000-0000-4000-8000-00000000000a';
const json = (status: number, body: unknown, type = 'application/json') =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': type } });
const renderForm = (canShare: boolean) =>
  render(
    <AppProviders client={createQueryClient()}>
      <ShareReportForm studyId={STUDY} canShare={canShare} />
    </AppProviders>,
  );

afterEach(() => vi.unstubAllGlobals());

describe('ShareReportForm', () => {
  it('posts the address and message to the share route and shows who it went to', async () => {
    const fetch = vi.fn(async () =>
      json(202, {
        sent: true,
        to: 'reviewer@kestrel.example',
        revision: 3,
        link: `http://x/studies/${STUDY}/report`,
      }),
    );
    vi.stubGlobal('fetch', fetch);
    renderForm(true);
    await userEvent.type(screen.getByLabelText('Recipient e-mail'), 'reviewer@kestrel.example');
    await userEvent.type(screen.getByLabelText(/Message/), 'Look at the sidebands.');
    await userEvent.click(screen.getByRole('button', { name: 'Send' }));
    expect(await screen.findByRole('status')).toHaveTextContent(
      'Sent to reviewer@kestrel.example.',
    );
    const [sent] = fetch.mock.calls[0] as unknown as [Request];
    expect(sent.method).toBe('POST');
    expect(sent.url).toMatch(new RegExp(`/api/v1/studies/${STUDY}/share$`));
    expect(await sent.json()).toEqual({
      email: 'reviewer@kestrel.example',
      message: 'Look at the sidebands.',
    });
  });

  it('shows the server field error beside the e-mail field', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        json(
          400,
          {
            type: 'about:blank',
            title: 'Bad request',
            status: 400,
            detail: 'bad',
            errors: [{ path: 'email', message: 'email must match format "email"' }],
          },
          'application/problem+json',
        ),
      ),
    );
    renderForm(true);
    await userEvent.type(screen.getByLabelText('Recipient e-mail'), 'nobody');
    await userEvent.click(screen.getByRole('button', { name: 'Send' }));
    expect(await screen.findByText('email must match format "email"')).toBeInTheDocument();
    expect(screen.getByLabelText('Recipient e-mail')).toHaveAttribute('aria-invalid', 'true');
  });

  it('is disabled for a viewer', () => {
    renderForm(false);
    expect(screen.getByLabelText('Recipient e-mail')).toBeDisabled();
    expect(screen.getByLabelText(/Message/)).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Send' })).toBeDisabled();
  });
});
