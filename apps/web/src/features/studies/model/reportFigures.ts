import { designResonance, generationRowReason } from '@pulsewright/modulation';
import type { StudyReport } from '../../../lib/api';
import type { Figure } from '../../../components/charts/FigureCards';
import { formatGain, formatNumber, formatPercent } from '../../../lib/format';

/** The point of coupling the limit check reads: the filter's output where there is a filter. */
export function limitPointName(report: StudyReport): string {
  return report.output ? report.output.name : report.bridge.name;
}

/**
 * The report's headline figures as the cards show them, each saying what it is of: exact
 * whole-waveform THD and WTHD (the truncated spectrum THD only with its order), the fundamental
 * per phase and line to line, the currents of phase a, the DC-link ripple and common-mode voltage,
 * load power, the filter's resonance (a grid design's LCL resonance with its distances from the
 * carrier and the control bandwidth, `designResonance`), a grid design's current THD with each
 * standard's verdict (and `generationRowReason` where IEEE 519's first row was read by its
 * generation footnote) and the limit result.
 * Display only: every number is a field of the report.
 */
export function reportFigures(report: StudyReport): Figure[] {
  const { bridge, lineToLine, output, filter, limitCheck } = report;
  const three = report.phaseCount === 3;
  const perPhase = three ? ', per phase' : '';
  const figures: Figure[] = [
    {
      label: 'Fundamental',
      value: `${formatNumber(bridge.fundamental)} V`,
      note: `peak, ${bridge.name}`,
    },
  ];
  if (lineToLine)
    figures.push({
      label: 'Fundamental, line-to-line',
      value: `${formatNumber(lineToLine.fundamental)} V`,
      note: `peak, ${lineToLine.name}`,
    });
  figures.push(
    {
      label: 'THD',
      value: formatPercent(bridge.thd),
      note: `exact, whole waveform, ${bridge.name} (${formatPercent(bridge.spectrumThd)} to order ${report.maxOrder})`,
    },
    {
      label: 'WTHD',
      value: formatPercent(bridge.wthd, 3),
      note: `exact, whole waveform, ${bridge.name}`,
    },
  );
  if (lineToLine)
    figures.push({
      label: 'THD, line-to-line',
      value: formatPercent(lineToLine.thd),
      note: `exact, whole waveform, ${lineToLine.name}`,
    });
  if (output) {
    figures.push(
      {
        label: 'Output fundamental',
        value: `${formatNumber(output.fundamental)} V`,
        note: `peak, ${output.name}`,
      },
      {
        label: 'Output THD',
        value: formatPercent(output.thd),
        note: `to order ${report.analysisOrder}; at most ${formatPercent(output.thdUpperBound)} over the whole waveform`,
      },
    );
  }
  const phaseA = report.currents[0];
  if (phaseA) {
    // Every phase carries the same RMS in a balanced design: the figures are phase a's.
    const rms = three ? `RMS per phase (phase ${phaseA.phase})` : 'RMS';
    figures.push(
      {
        label: 'Switch current',
        value: `${formatNumber(phaseA.inverter.rms)} A`,
        note: `${rms}; peak ${formatNumber(phaseA.inverter.peak)} A`,
      },
      {
        label: 'Current ripple',
        value: `${formatNumber(phaseA.inverter.rippleRms)} A`,
        note: `RMS of i − i₁ of the switch current${perPhase}; ${formatNumber(phaseA.inverter.ripplePeakToPeak)} A peak-to-peak`,
      },
    );
    if (phaseA.capacitor)
      figures.push({
        label: 'Capacitor current',
        value: `${formatNumber(phaseA.capacitor.rms)} A`,
        note: rms,
      });
    if (phaseA.load)
      figures.push({
        label: report.grid ? 'Grid current' : 'Load current',
        value: `${formatNumber(phaseA.load.rms)} A`,
        note: `${rms}; fundamental ${formatNumber(phaseA.load.fundamental)} A peak`,
      });
  }
  const { dcLink, commonMode } = report;
  if (dcLink) {
    figures.push({
      label: 'DC-link ripple',
      value: `${formatNumber(dcLink.rippleRms)} A`,
      note: `RMS of the AC part the capacitor carries; mean ${formatNumber(dcLink.mean)} A${
        dcLink.secondHarmonic !== null
          ? `; ${formatNumber(dcLink.secondHarmonic)} A peak at twice the output frequency`
          : ''
      }`,
    });
  }
  if (commonMode) {
    figures.push({
      label: 'Common-mode voltage',
      value: `${formatNumber(commonMode.rms)} V`,
      note: `RMS, star point to DC midpoint; ${
        commonMode.stepsPerCarrierPeriod !== null
          ? `${formatNumber(commonMode.stepsPerCarrierPeriod)} steps a carrier period, `
          : ''
      }${formatNumber(commonMode.stepsPerPeriod, 6)} a period`,
    });
  }
  if (report.loadPower !== null)
    figures.push({
      // With a grid the report's load is the grid's series resistance r (gridLoad in the library).
      label: report.grid ? 'Grid resistance loss' : 'Load power',
      value: `${formatNumber(report.loadPower)} W`,
      note: `into ${report.grid ? 'the grid’s series resistance r' : 'R'}${three ? ', all three phases' : ''}`,
    });
  // A grid design resonates at its LCL's frequency (the library's designResonance), not L1–C's.
  const resonance = designResonance(report);
  if (resonance?.name === 'LCL resonance')
    figures.push({
      label: resonance.name,
      value: `${formatNumber(resonance.frequency)} Hz`,
      note: `${resonance.distances ? `${resonance.distances}; ` : ''}L1, C and L2 with the grid’s L`,
    });
  else if (resonance && filter)
    figures.push({
      label: resonance.name === 'L1–C resonance' ? resonance.name : 'Filter resonance',
      value: `${formatNumber(resonance.frequency)} Hz`,
      note: `${filter.gainAtCarrier !== null ? `gain at the carrier ${formatGain(filter.gainAtCarrier)}; ` : ''}at the fundamental ${formatGain(filter.gainAtFundamental)}, loaded`,
    });
  const { grid } = report;
  if (grid) {
    const { ieee519, ieee1547 } = grid.limits;
    const verdict = (pass: boolean) => (pass ? 'within' : 'over');
    // Why IEEE 519's < 20 row was read for generating equipment at a higher I_SC/I_L, as the grid
    // panel and the printed table say it.
    const reason = generationRowReason(ieee519.row, ieee519.shortCircuitRatio);
    figures.push({
      label: 'Grid current THD',
      value: formatPercent(grid.gridCurrentThd),
      tone: ieee519.pass && ieee1547.pass ? 'good' : 'bad',
      note: `phase a; ${verdict(ieee519.pass)} ${ieee519.standard.name}-${ieee519.standard.edition}, ${verdict(ieee1547.pass)} ${ieee1547.standard.name}-${ieee1547.standard.edition} (limits recalled from memory${
        grid.harmonicGrouping
          ? '; read on IEC 61000-4-7 harmonic groups of the span’s components, from memory: confirm with the standard and the utility'
          : ''
      })${reason ? `. ${reason}` : ''}`,
    });
  }
  figures.push({
    label: 'Limit check',
    value: limitCheck.pass ? 'Pass' : 'Fail',
    tone: limitCheck.pass ? 'good' : 'bad',
    note: `${limitCheck.standard.name}, ${limitPointName(report)}`,
  });
  return figures;
}
