import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { patternCompareEvents, solveShe } from '@pulsewright/modulation';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { formatNumber } from '../../../lib/format';
import { StudyCompareEventsPanel } from './StudyCompareEventsPanel';

afterEach(() => vi.unstubAllGlobals());

// A 3-angle bipolar pattern eliminating the 5th and 7th at 80 V from 100 V (Patel and Hoft, 1973).
const angles = solveShe({
  kind: 'bipolar',
  vdc: 100,
  count: 3,
  eliminate: [5, 7],
  fundamental: 80,
}).angles;
const study = (id: string, method: string, modulation: object) => ({
  id,
  projectId: 'p',
  revision: 1,
  name: `Study ${id}`,
  method,
  design: { vdc: 100, fundamentalFrequency: 50, modulation },
  note: '',
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
});
const STUDIES = [
  study('she-1', 'selective-harmonic-elimination', {
    method: 'selective-harmonic-elimination',
    kind: 'bipolar',
    angles,
    eliminate: [5, 7],
  }),
  study('carrier-1', 'sine-triangle', { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 }),
];

const json = (body: unknown) =>
  new Response(JSON.stringify(body), {
    status: 200,
    headers: { 'Content-Type': 'application/json' },
  });

describe('StudyCompareEventsPanel (controller tables)', () => {
  it('lists the saved pattern studies only and asks for the events by study id', async () => {
    // The answer the service gives: the library's own events for the study's angles.
    const events = patternCompareEvents(
      { kind: 'bipolar', vdc: 100, angles },
      { fundamentalFrequency: 50, timerClock: 72e6, deadTime: 1e-6, orders: [5, 7] },
    );
    const fetch = vi.fn((input: Request) =>
      Promise.resolve(input.url.includes('/api/v1/studies') ? json(STUDIES) : json(events)),
    );
    vi.stubGlobal('fetch', fetch);
    render(
      <AppProviders client={createQueryClient()}>
        <StudyCompareEventsPanel />
      </AppProviders>,
    );
    const picker = await screen.findByLabelText('Saved pattern study');
    await screen.findByRole('option', { name: /Study she-1/ });
    expect(screen.queryByRole('option', { name: /Study carrier-1/ })).toBeNull();
    expect(screen.getByRole('button', { name: 'Compute the events' })).toBeDisabled();
    await userEvent.selectOptions(picker, 'she-1');
    await userEvent.click(screen.getByRole('button', { name: 'Compute the events' }));
    expect(await screen.findByTestId('dead-time-effect')).toHaveTextContent(
      `${formatNumber(events.ideal.fundamental)} V exact`,
    );
    const posted = fetch.mock.calls
      .map(([request]) => request)
      .find((request) => request.url.endsWith('/api/v1/pattern-compare-events'));
    expect(posted).toBeDefined();
    const body = (await posted?.json()) as Record<string, unknown>;
    expect(body).toMatchObject({ studyId: 'she-1', orders: [5, 7], fundamentalFrequency: 50 });
    expect(body.pattern).toBeUndefined();
  });
});
