import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { SweepForm } from './SweepForm';

afterEach(() => vi.unstubAllGlobals());

describe('SweepForm', () => {
  it('refuses a range whose end is below its start, naming both fields, before any request', () => {
    const fetch = vi.fn();
    vi.stubGlobal('fetch', fetch);
    render(
      <AppProviders client={createQueryClient()}>
        <SweepForm onStarted={() => undefined} />
      </AppProviders>,
    );
    expect(screen.getByRole('button', { name: 'Run the sweep' })).toBeEnabled();
    fireEvent.change(screen.getByLabelText(/^ma to/), { target: { value: '0.05' } });
    expect(screen.getByText(/ma to must be at least ma from, 0.1/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Run the sweep' })).toBeDisabled();
    // A three-phase sweep takes a zero sequence instead of the bridge scheme.
    expect(screen.getByLabelText(/Bridge scheme/)).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText(/^Method/), { target: { value: 'three-phase' } });
    expect(screen.getByLabelText(/Zero sequence/)).toBeInTheDocument();
    expect(fetch).not.toHaveBeenCalled();
  });
});
