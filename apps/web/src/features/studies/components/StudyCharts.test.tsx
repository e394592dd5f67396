import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent } from '../../../lib/format';
import { HarmonicLimitsPanel } from './HarmonicLimitsPanel';
import { StudyCharts } from './StudyCharts';

const threePhase: InverterDesign = {
  vdc: 600,
  fundamentalFrequency: 50,
  carrierFrequency: 2550,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'min-max' },
  load: { r: 8, l: 0.005 },
  filter: { l: 0.002, c: 20e-6, rDamping: 1 },
};

const figure = (label: string) => document.querySelector(`[data-figure="${label}"]`);

describe('StudyCharts', () => {
  it('a carrier that is no whole multiple: states p/q, the carrier analysed and the span, and draws over it', () => {
    // 1000 Hz at 37 Hz is 1000/37: the library's report over 37 periods (its carrierSpan).
    const report = analyseDesign(
      { ...threePhase, fundamentalFrequency: 37, carrierFrequency: 1000, filter: null },
      { maxOrder: 50, points: 256 },
    );
    render(<StudyCharts report={report} fileStem="t" />);
    const note = screen.getByTestId('carrier-span');
    expect(note).toHaveTextContent('mf = 1000/37 ≈ 27.027');
    expect(note).toHaveTextContent(`${formatNumber(1000, 9)} Hz (0 Hz from the one entered)`);
    expect(note).toHaveTextContent('repeats after 37 fundamental periods (1000 carrier cycles)');
    expect(note).toHaveTextContent(`step by ${formatNumber(1, 6)} Hz`);
    expect(
      screen.getByText('Modulator and bridge voltage over 37 fundamental periods'),
    ).toBeInTheDocument();
    expect(screen.getByText('Currents of phase a over 37 fundamental periods')).toBeInTheDocument();
    // The footers and axes name the span, not one fundamental period.
    expect(
      screen.getAllByText(/of the span of 37 fundamental periods \(0 to 2π is all 37/).length,
    ).toBeGreaterThan(0);
    expect(screen.getAllByText('span angle θ/37 (rad)').length).toBeGreaterThanOrEqual(2);
    // The modulator (the report's first fundamental period) is drawn over the first 2π/37 of the
    // axis: 56 px margin + 690 px plot width / 37.
    const reference = document.querySelector('[data-chart="waveform"] [data-trace="reference"]');
    const xs = [...(reference?.getAttribute('d') ?? '').matchAll(/[ML]([\d.]+),/g)].map((m) =>
      Number(m[1]),
    );
    expect(xs.length).toBeGreaterThan(100);
    // d3 writes path coordinates to 3 decimals.
    expect(Math.min(...xs)).toBeCloseTo(56, 2);
    expect(Math.max(...xs)).toBeCloseTo(56 + 690 / 37, 2);
    // A whole ratio says nothing of a span.
    const whole = analyseDesign({ ...threePhase, filter: null }, { maxOrder: 50, points: 256 });
    expect(whole.carrierSpan).toBeUndefined();
  });

  it('shows the report figures as they are: exact THD, per phase and line-to-line, currents and the limit result', () => {
    const report = analyseDesign(threePhase);
    render(<StudyCharts report={report} fileStem="t" />);
    expect(figure('THD')).toHaveTextContent(formatPercent(report.bridge.thd));
    expect(figure('THD, line-to-line')).toHaveTextContent(
      formatPercent(report.lineToLine?.thd ?? Number.NaN),
    );
    const summary = document.querySelector('dl[aria-label="Summary"]');
    expect(summary).toHaveTextContent('phase a to star point');
    expect(summary).toHaveTextContent('line a−b');
    expect(summary).toHaveTextContent(`to order ${report.maxOrder}`);
    expect(summary).toHaveTextContent('RMS per phase (phase a)');
    expect(figure('Capacitor current')).not.toBeNull();
    expect(figure('Filter resonance')).toHaveTextContent('Hz');
    expect(figure('Limit check')).toHaveTextContent(report.limitCheck.pass ? 'Pass' : 'Fail');
    expect(figure('DC-link ripple')).toHaveTextContent(
      `${formatNumber(report.dcLink?.rippleRms ?? Number.NaN)} A`,
    );
    expect(figure('Common-mode voltage')).toHaveTextContent(
      `${formatNumber(report.commonMode?.rms ?? Number.NaN)} V`,
    );
    expect(summary).toHaveTextContent(`${report.commonMode?.stepsPerPeriod} a period`);
    // The currents of each phase and the voltages by the report's names.
    expect(
      within(screen.getByRole('combobox', { name: 'Phase' })).getAllByRole('option'),
    ).toHaveLength(3);
    expect(
      within(screen.getByRole('combobox', { name: 'Voltage shown' }))
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(report.voltages.map((v) => v.name));
    expect(screen.getByText(`Spectrum to order ${report.maxOrder}`)).toBeInTheDocument();
  });

  it('labels a pattern spectrum by order, not by mf', () => {
    const report = analyseDesign({
      vdc: 100,
      fundamentalFrequency: 50,
      modulation: {
        method: 'selective-harmonic-elimination',
        kind: 'bipolar',
        angles: [0.3, 0.5, 0.9],
        eliminate: [5, 7],
      },
    });
    const { container } = render(<StudyCharts report={report} fileStem="p" />);
    const labels = Array.from(
      container.querySelectorAll('svg[data-chart="spectrum"] [data-labels] text'),
    ).map((t) => t.textContent ?? '');
    expect(labels.length).toBeGreaterThan(0);
    expect(labels.every((l) => /^\d+$/.test(l))).toBe(true);
  });
});

describe('HarmonicLimitsPanel', () => {
  it("shows the check of the filter's output with the table to order 50, the whole-waveform THD and the caution", () => {
    const report = analyseDesign(threePhase);
    render(<HarmonicLimitsPanel report={report} expanded />);
    const result = screen.getByTestId('limit-result');
    expect(result).toHaveAttribute('data-pass', String(report.limitCheck.pass));
    expect(result).toHaveTextContent('filter output');
    expect(figure('Limit THD, whole waveform')).toHaveTextContent(
      formatPercent(report.limitCheck.thdWholeWaveform),
    );
    const tables = screen.getAllByRole('table', { name: /^Limit check, orders/ });
    expect(tables.map((t) => t.getAttribute('aria-label'))).toEqual([
      'Limit check, orders 2 to 18',
      'Limit check, orders 19 to 34',
      'Limit check, orders 35 to 50',
    ]);
    expect(tables.reduce((rows, t) => rows + t.querySelectorAll('tbody tr').length, 0)).toBe(49);
    expect(result).toHaveTextContent(report.limitCheck.caution);
  });

  it('fails an unfiltered PWM voltage at a high frequency ratio on its whole-waveform THD, with the note', () => {
    const report = analyseDesign({
      vdc: 400,
      fundamentalFrequency: 50,
      carrierFrequency: 50 * 201,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    });
    render(<HarmonicLimitsPanel report={report} />);
    expect(screen.getByTestId('limit-result')).toHaveAttribute('data-pass', 'false');
    expect(screen.getByTestId('limit-note')).toHaveTextContent(
      report.limitCheck.note ?? 'missing note',
    );
    // Orders 2..50 of bipolar PWM at mf 201 are rounding noise (half-wave symmetry and the
    // sidebands far above): no worst order is named at the digits shown.
    expect(report.limitCheck.worstIndividual.ratio).toBeLessThan(5e-6);
    expect(figure('Limit worst single order')).toHaveTextContent('every order under 0.0005 %');
  });

  it('names the worst single order when it shows at the digits printed', () => {
    // Bipolar PWM at mf 9: the carrier harmonic (order 9) and its first sidebands (7 and 11,
    // mf ∓ 2; Holmes and Lipo, 2003, ch. 3) lie inside the table, well above rounding.
    const report = analyseDesign({
      vdc: 400,
      fundamentalFrequency: 50,
      carrierFrequency: 50 * 9,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    });
    render(<HarmonicLimitsPanel report={report} />);
    const { order, ratio } = report.limitCheck.worstIndividual;
    expect(ratio).toBeGreaterThan(0.01);
    expect(figure('Limit worst single order')).toHaveTextContent(
      `${order} at ${formatPercent(ratio, 3)}`,
    );
  });
});
