import { harmonics, labelHarmonics, sineTriangle } from '@pulsewright/modulation';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { catchDownloads } from '../../testing/downloads';
import { LineChart } from './LineChart';
import { SpectrumChart } from './SpectrumChart';
import { WaveformChart } from './WaveformChart';

/** Clicks a chart's CSV button and reads back the file it saves (name, type and text). */
async function downloadedCsv(name: RegExp) {
  const downloads = catchDownloads();
  fireEvent.click(screen.getByRole('button', { name }));
  return downloads.saved();
}

const rows = (text: string) =>
  text
    .trimEnd()
    .split('\n')
    .map((line) => line.split(','));

afterEach(() => vi.restoreAllMocks());

describe("a chart's data as CSV with units in the header", () => {
  // Bipolar bridge, ma 0.8, odd mf 15, 100 V bus: the library's exact spectrum and labels.
  const mf = 15;
  const waveform = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf, vdc: 100 });
  const spectrum = labelHarmonics(harmonics(waveform, 60), mf);

  it('spectrum: each order with its label and amplitude in peak volts', async () => {
    render(
      <SpectrumChart
        title="Bridge spectrum"
        fileName="bridge-spectrum"
        series={[{ name: 'bridge output', color: '#000', harmonics: spectrum }]}
      />,
    );
    const { type, text, file } = await downloadedCsv(/Bridge spectrum data as CSV/);
    expect(type).toMatch(/^text\/csv/);
    expect(file).toBe('bridge-spectrum.csv');
    const [header, ...body] = rows(text);
    expect(header).toEqual(['order', 'label', 'bridge output amplitude (V peak)']);
    expect(body).toHaveLength(61);
    // In the linear range the fundamental of a bipolar full bridge is ma·vdc = 80 V (common
    // practice; docs/references.md), to floating-point precision.
    const fundamental = body.find((r) => r[0] === '1');
    expect(Math.abs(Number(fundamental?.[2]) - 80)).toBeLessThan(1e-9);
    // With odd mf the bipolar waveform has half-wave symmetry: no even orders (common practice).
    for (const r of body.filter((r) => Number(r[0]) % 2 === 0))
      expect(Number(r[2])).toBeLessThan(1e-9);
    // Every value is the one the chart draws, written in full.
    body.forEach((r, i) => expect(Number(r[2])).toBe(spectrum[i]?.amplitude));
    expect(body.find((r) => r[0] === String(mf))?.[1]).toBe('mf');
  });

  it('line chart (sweeps, elimination branches): one row per point under the axis labels', async () => {
    render(
      <LineChart
        title="THD against ma"
        fileName="ma-sweep"
        xLabel="modulation index ma"
        yLabel="THD (ratio)"
        series={[
          { name: '=cmd|evil', color: '#000', x: [0.2, 0.6], y: [1.5, 0.9] },
          { name: 'WTHD', color: '#111', x: [0.2], y: [0.01] },
        ]}
      />,
    );
    const { text } = await downloadedCsv(/THD against ma data as CSV/);
    // A name a spreadsheet would run as a formula is written as text (CSV injection).
    expect(rows(text)).toEqual([
      ['series', 'modulation index ma', 'THD (ratio)'],
      ["'=cmd|evil", '0.2', '1.5'],
      ["'=cmd|evil", '0.6', '0.9'],
      ['WTHD', '0.2', '0.01'],
    ]);
  });

  it('waveform: every edge of the output with the level held from it, in volts', async () => {
    render(<WaveformChart output={waveform} outputName="bridge output" />);
    const { text } = await downloadedCsv(/data as CSV/);
    const [header, ...body] = rows(text);
    expect(header).toEqual(['signal', 'angle (rad)', 'voltage (V)', 'per unit of carrier peak']);
    expect(body.map((r) => [Number(r[1]), Number(r[2])])).toEqual(
      waveform.edges.map((edge, i) => [edge, waveform.levels[i]]),
    );
    // A bipolar bridge switches between ±vdc only (common practice).
    expect(new Set(body.map((r) => r[2]))).toEqual(new Set(['100', '-100']));
  });
});
