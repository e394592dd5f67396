import { analyseDesign, EXAMPLE_IGBT, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber } from '../../../../lib/format';
import { StudyCharts } from '../StudyCharts';

const design = (topology: 'npc' | 't-type', withDevice = true): InverterDesign => ({
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 1050,
  modulation: {
    method: 'multilevel-carrier',
    topology,
    levels: 3,
    carriers: 'pd',
    phaseCount: 3,
    ma: 0.9,
  },
  load: { r: 10, l: 0.01 },
  ...(withDevice ? { device: { ...EXAMPLE_IGBT } } : {}),
});

const width = (bar: Element | undefined, part: string) =>
  Number(bar?.querySelector(`rect[data-part="${part}"]`)?.getAttribute('width'));

describe('MultilevelLossPanel', () => {
  it('draws a three-phase NPC bridge’s losses by position (conduction and switching stacked) and by class', () => {
    const report = analyseDesign(design('npc'));
    const losses = report.multilevel?.losses;
    if (!losses) throw new Error('expected multilevel losses');
    render(<StudyCharts report={report} fileStem="npc" />);
    const chart = screen.getByRole('figure', { name: 'Losses by device position (NPC)' });
    const bars = chart.querySelectorAll('g[data-bar]');
    // Three legs of six positions: S1…S4 and the clamp diodes D5, D6 (Nabae et al. 1981).
    expect(bars).toHaveLength(18);
    expect(bars[0]?.getAttribute('data-bar')).toBe('leg a, S1 (outer switch)');
    expect(bars[4]?.getAttribute('data-bar')).toBe('leg a, D5 (clamp diode)');
    expect(bars[17]?.getAttribute('data-bar')).toBe('leg c, D6 (clamp diode)');
    // Widths in proportion to the report's watts (transistor and diode of the position summed).
    const s1 = losses.legs[0]?.positions[0];
    if (!s1) throw new Error('expected leg a, S1');
    expect(width(bars[0], 'switching') / width(bars[0], 'conduction')).toBeCloseTo(
      (s1.transistor.switching + s1.diode.switching) /
        (s1.transistor.conduction + s1.diode.conduction),
      6,
    );
    expect(within(chart).getByRole('button', { name: /data as CSV/ })).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Losses by device class' });
    const rows = [...table.querySelectorAll('tr[data-class]')];
    expect(rows.map((r) => r.getAttribute('data-class'))).toEqual([
      'outer switch',
      'inner switch',
      'clamp diode',
    ]);
    losses.classes.forEach((c, i) => {
      expect(rows[i]).toHaveTextContent(formatNumber(c.total));
      expect(rows[i]).toHaveTextContent(formatNumber(c.hottestPosition));
    });
    expect(within(table).getByText(new RegExp(formatNumber(losses.total)))).toBeInTheDocument();
    // The two-level panel stays away: its losses are null for a multilevel bridge.
    expect(screen.queryByRole('figure', { name: /Losses by device \(/ })).toBeNull();
  });

  it('names a T-type bridge’s middle switches and draws four positions a leg', () => {
    render(<StudyCharts report={analyseDesign(design('t-type'))} fileStem="t" />);
    const chart = screen.getByRole('figure', { name: 'Losses by device position (T-type)' });
    expect(chart.querySelectorAll('g[data-bar]')).toHaveLength(12);
    expect(chart.querySelector('g[data-bar="leg a, S2 (middle switch)"]')).not.toBeNull();
  });

  it('draws nothing without a device', () => {
    render(<StudyCharts report={analyseDesign(design('npc', false))} fileStem="npc" />);
    expect(screen.queryByRole('region', { name: 'Multilevel losses' })).toBeNull();
  });
});
