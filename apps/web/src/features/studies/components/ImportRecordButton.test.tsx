import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import { ImportRecordButton } from './ImportRecordButton';

const PROJECT = '00000000-0000-4000-8000-00000000000b';
const NEW_STUDY = '00000000-0000-4000-8000-00000000000c';
const RECORD = {
  format: 'pulsewright-study-record',
  formatVersion: 1,
  name: 'Pump drive',
  note: '',
  design: {
    vdc: 400,
    fundamentalFrequency: 50,
    carrierFrequency: 1050,
    modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  },
};
const json = (status: number, body: unknown, type = 'application/json') =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': type } });
const renderPicker = (projectId = PROJECT) =>
  render(
    <AppProviders client={createQueryClient()}>
      <MemoryRouter initialEntries={['/studies']}>
        <Routes>
          <Route path="/studies" element={<ImportRecordButton projectId={projectId} />} />
          <Route path="/studies/:id" element={<p>study page</p>} />
        </Routes>
      </MemoryRouter>
    </AppProviders>,
  );
const file = (text: string) => new File([text], 'pump.study.json', { type: 'application/json' });

afterEach(() => vi.unstubAllGlobals());

describe('ImportRecordButton', () => {
  it('posts the chosen record to the project and opens the new study', async () => {
    const fetch = vi.fn(async () =>
      json(201, {
        ...RECORD,
        id: NEW_STUDY,
        projectId: PROJECT,
        revision: 1,
        method: 'sine-triangle',
      }),
    );
    vi.stubGlobal('fetch', fetch);
    renderPicker();
    await userEvent.upload(screen.getByLabelText('Import record'), file(JSON.stringify(RECORD)));
    expect(await screen.findByText('study page')).toBeInTheDocument();
    const [sent] = fetch.mock.calls[0] as unknown as [Request];
    expect(sent.method).toBe('POST');
    expect(sent.url).toMatch(new RegExp(`/api/v1/projects/${PROJECT}/study-records$`));
    expect(await sent.json()).toEqual(RECORD);
  });

  it("shows the service's message for a refused record, and a file that is not JSON", async () => {
    const detail = 'formatVersion 2 is newer than this service reads (1): …';
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        json(
          400,
          { type: 'about:blank', title: 'Bad request', status: 400, detail, errors: [] },
          'application/problem+json',
        ),
      ),
    );
    renderPicker();
    await userEvent.upload(
      screen.getByLabelText('Import record'),
      file(JSON.stringify({ ...RECORD, formatVersion: 2 })),
    );
    expect(await screen.findByRole('alert')).toHaveTextContent(detail);
    await userEvent.upload(screen.getByLabelText('Import record'), file('{ not json'));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'pump.study.json is not a JSON study record',
    );
  });

  it('waits for a project to import into', () => {
    renderPicker('');
    expect(screen.getByLabelText('Import record')).toBeDisabled();
  });
});
