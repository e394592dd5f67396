import {
  describeGridConnection,
  designResonance,
  type CurrentFigures,
  type DesignReport,
  type InverterDesign,
  type VoltageFigures,
} from '@pulsewright/modulation';
import { formatNumber, formatPercent } from './formatNumber.js';
import { formatTable } from './formatTable.js';

/**
 * The design report as text a person reads: the method, the voltages (fundamental, rms, THD,
 * WTHD), the currents of each phase, the load power, DC-link and common-mode figures, the
 * filter, the grid a grid-tied design feeds with its current's verdict (the library's
 * `describeGridConnection`, so it reads as the printed report and the shared e-mail do), the limit
 * check and the cautions. Every figure is the report's own, rounded to six significant digits
 * (the grid's words to four); `--json` gives them all in full.
 */
export function formatReport(report: DesignReport, design: InverterDesign): string {
  const parts: string[] = [];
  const span = report.carrierSpan;
  const ratio =
    report.frequencyRatio === null
      ? 'no carrier (stored pattern)'
      : span
        ? `frequency ratio mf ${span.p}/${span.q} ≈ ${formatNumber(report.frequencyRatio)} (carrier analysed ${formatNumber(span.carrierFrequency)} Hz, ${formatNumber(span.carrierError)} Hz from the one given; every figure over ${span.q} fundamental periods, spectra in steps of ${formatNumber(span.baseFrequency)} Hz with the sub-harmonics)`
        : `frequency ratio mf ${report.frequencyRatio}`;
  parts.push(
    `${report.methodLabel} (${report.method}), ${report.phaseCount === 3 ? 'three-phase' : 'single-phase'} bridge\n` +
      `fundamental frequency ${formatNumber(report.fundamentalFrequency)} Hz, ${ratio}, spectra to order ${report.maxOrder}\n`,
  );
  const voltages: VoltageFigures[] = [
    report.bridge,
    ...(report.lineToLine ? [report.lineToLine] : []),
    ...(report.output ? [report.output] : []),
  ];
  parts.push(
    formatTable(
      ['voltage', 'fundamental (V peak)', 'rms (V)', 'THD (%)', 'WTHD (%)', 'THD to maxOrder (%)'],
      voltages.map((v) => [
        v.name,
        formatNumber(v.fundamental),
        formatNumber(v.rms),
        v.exact
          ? formatPercent(v.thd)
          : `${formatPercent(v.thd)} (≤ ${formatPercent(v.thdUpperBound)})`,
        formatPercent(v.wthd),
        formatPercent(v.spectrumThd),
      ]),
    ),
  );
  const currents: CurrentFigures[] = report.currents.flatMap((phase) => [
    phase.inverter,
    ...(phase.capacitor ? [phase.capacitor] : []),
    ...(phase.load ? [phase.load] : []),
  ]);
  if (currents.length > 0) {
    parts.push(
      formatTable(
        [
          'current',
          'rms (A)',
          'peak (A)',
          'fundamental (A peak)',
          'ripple rms (A)',
          'ripple p-p (A)',
        ],
        currents.map((c) => [
          c.name,
          formatNumber(c.rms),
          formatNumber(c.peak),
          formatNumber(c.fundamental),
          formatNumber(c.rippleRms),
          formatNumber(c.ripplePeakToPeak),
        ]),
      ),
    );
  }
  const lines: string[] = [];
  if (report.loadPower !== null)
    // With a grid the report's load is the grid's series resistance r (the library's gridLoad).
    lines.push(
      `${report.grid ? "power into the grid's series resistance" : 'load power'} (all phases): ${formatNumber(report.loadPower)} W`,
    );
  if (report.dcLink !== null) {
    const d = report.dcLink;
    const second =
      d.secondHarmonic === null
        ? ''
        : `, at twice the output frequency ${formatNumber(d.secondHarmonic)} A peak`;
    lines.push(
      `DC-link current: mean ${formatNumber(d.mean)} A, rms ${formatNumber(d.rms)} A, capacitor ripple rms ${formatNumber(d.rippleRms)} A${second}`,
    );
  }
  if (report.commonMode !== null) {
    const c = report.commonMode;
    const perCarrier =
      c.stepsPerCarrierPeriod === null
        ? ''
        : `, ${formatNumber(c.stepsPerCarrierPeriod)} per carrier period`;
    lines.push(
      `${c.name}: rms ${formatNumber(c.rms)} V, levels ${c.levels.map((l) => formatNumber(l)).join(', ')} V, ${c.stepsPerPeriod} steps per period${perCarrier}`,
    );
  }
  if (report.filter !== null) {
    const f = report.filter;
    const k = f.characteristics;
    // A grid design resonates at its LCL's frequency; the filter's own figures are L1 with C alone.
    const resonance = designResonance(report);
    const lcl =
      resonance?.name === 'LCL resonance'
        ? `${resonance.name} ${formatNumber(resonance.frequency)} Hz${resonance.distances ? ` (${resonance.distances})` : ''}; L1 with C alone (without L2 and the grid): `
        : '';
    lines.push(
      `filter: ${lcl}${resonance?.name === 'L1–C resonance' ? 'L1–C resonance' : 'resonance'} ${formatNumber(k.resonanceFrequency)} Hz, characteristic impedance ${formatNumber(k.characteristicImpedance)} Ω, ` +
        `damping ratio ${formatNumber(k.dampingRatio)}, peak gain ${formatNumber(k.peakGain)}; loaded gain at the fundamental ${formatNumber(f.gainAtFundamental)}, ` +
        `at the carrier ${formatNumber(f.gainAtCarrier)}`,
    );
  }
  if (lines.length > 0) parts.push(`${lines.join('\n')}\n`);
  const grid = describeGridConnection(design, report.grid);
  if (grid)
    parts.push(
      `grid connection:\n${grid.rows.map(([label, value]) => `  ${label}: ${value}`).join('\n')}\n` +
        `grid current limits (phase a):\n${grid.verdicts.map((v) => `  ${v}`).join('\n')}\n` +
        (grid.caution === null ? '' : `  caution: ${grid.caution}\n`),
    );
  const check = report.limitCheck;
  const worst = check.worstIndividual;
  const violations =
    check.violations.length === 0
      ? 'none'
      : check.violations
          .map(
            (v) =>
              `${v.order === 'thd' ? 'THD' : v.order === 'thd-whole-waveform' ? 'THD (whole waveform)' : `order ${v.order}`} ${formatPercent(v.ratio)} % > ${formatPercent(v.limit)} %`,
          )
          .join('; ');
  parts.push(
    `limit check (${check.standard.name}-${check.standard.edition} ${check.standard.table}, bus ${formatNumber(check.busVoltage)} V rms line to line, ${check.limits.busRange}): ${check.pass ? 'PASS' : 'FAIL'}\n` +
      `  individual limit ${formatPercent(check.limits.individual)} %, worst order ${worst.order} at ${formatPercent(worst.ratio)} %; ` +
      `THD to order ${check.limits.maxOrder} ${formatPercent(check.thd)} %, whole waveform ${formatPercent(check.thdWholeWaveform)} % (limit ${formatPercent(check.limits.thd)} %)\n` +
      `  over the limit: ${violations}\n` +
      (check.note === null ? '' : `  note: ${check.note}\n`),
  );
  parts.push(
    `cautions:\n${[...report.cautions, check.caution]
      .filter((c, i, all) => all.indexOf(c) === i)
      .map((c) => `  - ${c}`)
      .join('\n')}\n`,
  );
  return parts.join('\n');
}
