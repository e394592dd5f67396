import { designLclFilter } from '@pulsewright/modulation';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { formatNumber } from '../../../lib/format';
import { defaultDraft, type StudyDraft } from '../model/studyDraft';
import { LclSizing } from './LclSizing';

afterEach(() => vi.unstubAllGlobals());

const json = (body: unknown, status = 200, type = 'application/json') =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': type } });

// A 400 V, 50 Hz grid fed from 700 V at 10 kHz (invented values).
const draft: StudyDraft = {
  ...defaultDraft(),
  gridOn: true,
  gridLineVoltage: 400,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  vdc: 700,
};

describe('LclSizing', () => {
  it('asks the service to size the LCL for the draft and puts L1, C, R_d and L2 in the fields', async () => {
    // The service's answer is the library's own designLclFilter for the same request.
    const request = {
      power: 15_000,
      lineVoltage: 400,
      gridFrequency: 50,
      switchingFrequency: 10_000,
      vdc: 700,
    };
    const sized = designLclFilter(request);
    const fetch = vi.fn(() => Promise.resolve(json(sized)));
    vi.stubGlobal('fetch', fetch);
    const onChange = vi.fn();
    render(<LclSizing draft={draft} onChange={onChange} readOnly={false} />);
    await userEvent.clear(screen.getByLabelText(/Rated power/));
    await userEvent.type(screen.getByLabelText(/Rated power/), '15');
    await userEvent.click(screen.getByRole('button', { name: /Size the LCL filter/ }));
    const summary = await screen.findByTestId('lcl-sizing');
    const [sent] = fetch.mock.calls[0] as unknown as [Request];
    expect(sent.url).toMatch(/\/api\/v1\/filters\/lcl-design$/);
    expect(await sent.json()).toEqual(request);
    expect(onChange).toHaveBeenCalledWith({
      filterOn: true,
      filterL: sized.l1,
      filterC: sized.c,
      filterR: sized.rDamping,
      dampingPlacement: 'series-with-capacitor',
      gridL2: sized.l2,
    });
    expect(summary).toHaveTextContent(`resonance ${formatNumber(sized.resonanceFrequency)} Hz`);
    for (const note of sized.notes) expect(summary).toHaveTextContent(note);
  });

  it('puts the service’s refusal of the rated power on its field', async () => {
    const message = 'power must be a finite number in [1, 1000000000]; got 0';
    vi.stubGlobal(
      'fetch',
      vi.fn(() =>
        Promise.resolve(
          json(
            {
              type: 'about:blank',
              title: 'Bad request',
              status: 400,
              detail: message,
              errors: [{ path: '/body/power', message }],
            },
            400,
            'application/problem+json',
          ),
        ),
      ),
    );
    render(<LclSizing draft={draft} onChange={vi.fn()} readOnly={false} />);
    await userEvent.click(screen.getByRole('button', { name: /Size the LCL filter/ }));
    expect(await screen.findByText(message)).toBeInTheDocument();
    expect(screen.getByLabelText(/Rated power/)).toHaveAccessibleDescription(message);
    expect(screen.queryByTestId('lcl-sizing')).toBeNull();
  });
});
