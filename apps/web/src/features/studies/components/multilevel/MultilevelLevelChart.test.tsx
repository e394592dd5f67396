import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { stepRowsCsv } from '../../../../components/charts/StackedStepChart';
import { waveformChartCsv } from '../../../../lib/chartCsv';
import { formatNumber } from '../../../../lib/format';
import { StudyCharts } from '../StudyCharts';
import { multilevelRows } from './MultilevelLevelChart';

const design = (
  modulation: Partial<Extract<InverterDesign['modulation'], { method: 'multilevel-carrier' }>>,
): InverterDesign => ({
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 1050,
  modulation: {
    method: 'multilevel-carrier',
    topology: 'npc',
    levels: 3,
    carriers: 'pd',
    phaseCount: 3,
    ma: 0.9,
    ...modulation,
  },
  load: { r: 10, l: 0.01 },
});

const rowNames = () =>
  [...document.querySelectorAll('svg[data-chart="stacked-steps"] [data-row]')].map((g) =>
    g.getAttribute('data-row'),
  );

describe('the multilevel level chart and figures', () => {
  it('draws each leg of a three-phase NPC bridge on its three levels, and no cells', () => {
    const report = analyseDesign(design({}));
    render(<StudyCharts report={report} fileStem="npc" />);
    expect(rowNames()).toEqual(['leg a', 'leg b', 'leg c']);
    // Three levels at ±vdc/2 and the midpoint (the NPC leg's output, Nabae et al. 1981).
    const legA = document.querySelector('[data-row="leg a"]');
    expect(legA).toHaveTextContent('-400');
    expect(legA).toHaveTextContent('400');
    const devices = screen.getByRole('table', { name: 'Device switching frequencies' });
    expect(within(devices).getAllByRole('row')).toHaveLength(1 + 4);
    expect(devices).toHaveTextContent('S1');
    expect(
      document.querySelector('[data-figure="Mean device switching frequency"]'),
    ).toHaveTextContent(
      `${formatNumber(report.multilevel?.averageDeviceFrequency ?? Number.NaN)} Hz`,
    );
    // The midpoint current as the report gives it; with sine references and a balanced load its
    // mean over the fundamental is near zero (Celanovic and Boroyevich 2000): shown, not computed.
    const neutral = report.multilevel?.balance?.neutralPoint;
    if (!neutral) throw new Error('an NPC design with a load has neutral-point figures');
    const table = screen.getByRole('table', { name: 'Neutral-point figures' });
    expect(table).toHaveTextContent(formatNumber(neutral.lowFrequencyRipple));
    expect(table).toHaveTextContent('not given: no DC-link capacitance');
    expect(screen.getByRole('figure', { name: /Neutral-point current/ })).toBeInTheDocument();
  });

  it("stacks a flying-capacitor leg's commutation cells (0/1) under the legs, cell 1 first", () => {
    const report = analyseDesign(
      design({ topology: 'flying-capacitor', levels: 4, carriers: 'phase-shifted' }),
    );
    render(<StudyCharts report={report} fileStem="fc" />);
    expect(rowNames()).toEqual([
      'leg a',
      'leg b',
      'leg c',
      'leg a, cell 1 upper switch',
      'leg a, cell 2 upper switch',
      'leg a, cell 3 upper switch',
    ]);
    // A four-level leg holds levels − 2 = 2 flying capacitors (Meynard and Foch 1992), in three
    // legs; charge shown in µC (the report's coulombs × 1e6).
    const table = screen.getByRole('table', { name: 'Flying-capacitor figures' });
    expect(within(table).getAllByRole('row')).toHaveLength(1 + 3 * 2);
    const first = report.multilevel?.balance?.flyingCapacitors?.legs[0]?.capacitors[0];
    if (!first) throw new Error('a flying-capacitor design with a load has capacitor figures');
    expect(table).toHaveTextContent(formatNumber(first.maxChargePerCarrierPeriod * 1e6));
  });

  it("gives a cascaded string's cells in volts and the CSV every edge of every row", () => {
    const report = analyseDesign(
      design({
        topology: 'cascaded-h-bridge',
        levels: 5,
        carriers: 'phase-shifted',
        phaseCount: 1,
      }),
    );
    const multilevel = report.multilevel;
    if (!multilevel) throw new Error('a multilevel design has multilevel figures');
    const rows = multilevelRows(multilevel);
    expect(rows.map((r) => [r.name, r.unit])).toEqual([
      ['string a', 'V'],
      ['string a, cell 1', 'V'],
      ['string a, cell 2', 'V'],
    ]);
    // A cascaded cell on its own source takes −vdc, 0 and +vdc (the design's vdc is each cell's source).
    expect(rows[1]?.levels).toEqual([-800, 0, 800]);
    const csv = stepRowsCsv(rows).trim().split(/\r?\n/);
    const edges = rows.reduce((sum, r) => sum + r.waveform.edges.length, 0);
    expect(csv).toHaveLength(1 + edges);
    expect(csv[0]).toBe('signal,angle (rad),value from this edge,unit');
  });

  it('draws and exports every carrier of the modulator: levels − 1 PD bands', () => {
    const report = analyseDesign(design({}));
    render(<StudyCharts report={report} fileStem="npc" />);
    // A three-level PD modulator compares the reference with two bands (McGrath and Holmes 2002).
    expect(document.querySelectorAll('svg[data-chart="waveform"] [data-carrier]')).toHaveLength(2);
    const modulator = report.modulator;
    if (!modulator) throw new Error('a carrier method has a modulator');
    const output = report.voltages[0]?.waveform ?? { edges: [], levels: [] };
    const csv = waveformChartCsv({ output, outputName: 'v', modulator });
    const lines = csv.trim().split(/\r?\n/);
    expect(lines.filter((l) => l.startsWith('carrier 2,'))).toHaveLength(modulator.angles.length);
  });

  it("lists a cascaded string's cell sources with their power and the string's total", () => {
    const report = analyseDesign(
      design({ topology: 'cascaded-h-bridge', levels: 7, carriers: 'phase-shifted' }),
    );
    render(<StudyCharts report={report} fileStem="chb" />);
    const power = report.multilevel?.balance?.cellPower;
    if (!power) throw new Error('a cascaded design with a load has cell power figures');
    const table = screen.getByRole('table', { name: 'Cell source figures' });
    // Three strings of three cells, and a total row a string.
    expect(within(table).getAllByRole('row')).toHaveLength(1 + 3 * (3 + 1));
    expect(table).toHaveTextContent(formatNumber(power.strings[0]?.power ?? Number.NaN));
    expect(screen.getByTestId('cell-power-spread')).toHaveTextContent(
      formatNumber(power.powerSpread ?? Number.NaN),
    );
  });
});
