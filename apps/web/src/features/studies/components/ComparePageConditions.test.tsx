import {
  analyseDesign,
  designCarrierSpan,
  EXAMPLE_IGBT,
  type InverterDesign,
} from '@pulsewright/modulation';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders, createQueryClient } from '../../../app/providers';
import * as download from '../../../lib/download';
import { formatNumber } from '../../../lib/format';
import { ComparePage } from './ComparePage';

const A = '00000000-0000-4000-8000-0000000000a1';
const B = '00000000-0000-4000-8000-0000000000b2';
const drive = (zeroSequence: 'none' | 'dpwm1'): InverterDesign => ({
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 99,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence },
  load: { r: 8, l: 0.01 },
  device: { ...EXAMPLE_IGBT },
});
const designs: Record<string, InverterDesign> = { [A]: drive('none'), [B]: drive('dpwm1') };
const names: Record<string, string> = { [A]: 'SPWM', [B]: 'DPWM1' };
const study = (id: string) => ({
  id,
  projectId: A,
  revision: 1,
  name: names[id],
  method: 'three-phase',
  design: designs[id],
  note: '',
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
});
const json = (body: unknown) =>
  new Response(JSON.stringify(body), {
    status: 200,
    headers: { 'Content-Type': 'application/json' },
  });

afterEach(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe('ComparePage at equal conditions', () => {
  it('scales the DPWM1 carrier 1.5× at equal average device switching frequency and names the condition in the CSV', async () => {
    const posted: InverterDesign[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (request: Request) => {
        const path = new URL(request.url).pathname;
        // The service's answers are the library's reports sent as JSON.
        if (path.endsWith('/designs/report')) {
          const body = (await request.json()) as { design: InverterDesign; points?: number };
          posted.push(body.design);
          return json(analyseDesign(body.design, { points: body.points ?? 1200 }));
        }
        const report = /\/studies\/([\w-]+)\/report$/.exec(path);
        if (report) return json(analyseDesign(designs[report[1] ?? ''] as InverterDesign));
        const one = /\/studies\/([\w-]+)$/.exec(path);
        if (one) return json(study(one[1] ?? ''));
        return json([study(A), study(B)]);
      }),
    );
    const saved = vi.spyOn(download, 'downloadText').mockImplementation(() => undefined);
    render(
      <AppProviders client={createQueryClient()}>
        <MemoryRouter initialEntries={[`/compare?ids=${A},${B}`]}>
          <ComparePage />
        </MemoryRouter>
      </AppProviders>,
    );
    const table = await screen.findByTestId('compare-figures', {}, { timeout: 10_000 });
    const cell = (name: string, column: string) =>
      table.querySelector(`tr[data-study="${name}"] [data-column="${column}"]`);
    expect(cell('DPWM1', 'Carrier (Hz)')).toHaveTextContent(formatNumber(4950));

    fireEvent.change(screen.getByLabelText('Compare at'), {
      target: { value: 'equal-device-frequency' },
    });
    // A 120° clamp switches 2/3 of the period: 1.5× the carrier for the same average device
    // switching frequency (A. M. Hava, R. J. Kerkman, T. A. Lipo, 1999; from memory), within the
    // clamp edges' partial periods (0.03); kept as scaled, so mf is a fraction p/q (the report
    // spans it) rather than rounded to a whole one.
    await waitFor(() => expect(posted).toHaveLength(1), { timeout: 10_000 });
    const carrier = posted[0]?.carrierFrequency ?? 0;
    expect(carrier / 4950).toBeGreaterThan(1.47);
    expect(carrier / 4950).toBeLessThan(1.53);
    const span = designCarrierSpan(posted[0] as InverterDesign);
    expect(span?.q).toBeGreaterThan(1);
    await waitFor(
      () => expect(cell('DPWM1', 'Carrier (Hz)')).toHaveTextContent(formatNumber(carrier)),
      { timeout: 10_000 },
    );
    expect(cell('DPWM1', 'mf')).toHaveTextContent(`${span?.p}/${span?.q}`);
    expect(cell('DPWM1', 'Carrier (Hz)')?.getAttribute('title')).toMatch(/kept as scaled/);
    expect(cell('SPWM', 'Carrier (Hz)')).toHaveTextContent(formatNumber(4950));
    // The DPWM1 row shows the adjusted design's report (its device switching frequency near SPWM's).
    const spwm = analyseDesign(designs[A] as InverterDesign);
    const adjusted = analyseDesign(posted[0] as InverterDesign);
    expect(cell('DPWM1', 'Device switching (Hz)')).toHaveTextContent(
      formatNumber(adjusted.switching?.averageDeviceFrequency ?? Number.NaN),
    );
    expect(
      Math.abs(
        (adjusted.switching?.averageDeviceFrequency ?? 0) /
          (spwm.switching?.averageDeviceFrequency ?? 1) -
          1,
      ),
    ).toBeLessThan(0.04);

    fireEvent.click(screen.getByRole('button', { name: 'CSV' }));
    const csv = saved.mock.calls.at(-1)?.[0] ?? '';
    expect(csv.split('\r\n')[0]).toContain('equal average device switching frequency');
  }, 30_000);
});
