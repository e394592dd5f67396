import { designResonance } from '@pulsewright/modulation';
import { formatGain, formatNumber, formatPercent } from '../../../lib/format';
import type { StudyReport } from '../../../lib/api';
import { limitPointName } from '../model/reportFigures';
import type { ConditionedRow } from './useEqualConditions';

/**
 * A column of the figures table: its heading and the cell of one report (the report of the design
 * at the chosen condition; `row` holds what the condition did to its carrier).
 */
export interface Column {
  heading: string;
  cell: (report: StudyReport, row: ConditionedRow) => string;
  title?: (report: StudyReport, row: ConditionedRow) => string;
  /** The figure in the report's units, for sorting and the CSV; null where the study has none. */
  value?: (report: StudyReport, row: ConditionedRow) => number | null;
}

const phaseA = (report: StudyReport) => report.currents[0];

/** Every column comes from the same design report of each study. */
export const COLUMNS: Column[] = [
  {
    heading: 'Method',
    // A multilevel design names its bridge, so it reads apart from a two-level one beside it.
    cell: (r) =>
      r.multilevel ? `${r.multilevel.topologyLabel}, ${r.multilevel.levels} levels` : r.methodLabel,
    title: (r) =>
      r.multilevel?.carriersLabel
        ? `${r.methodLabel}; ${r.multilevel.carriersLabel}`
        : r.methodLabel,
  },
  {
    heading: 'Carrier (Hz)',
    cell: (_, row) => (row.carrierFrequency === null ? '—' : formatNumber(row.carrierFrequency)),
    value: (_, row) => row.carrierFrequency,
    title: (r, row) =>
      row.note ??
      (row.factor === 1
        ? 'as designed'
        : `${formatNumber(row.factor)} × the carrier as designed${r.carrierSpan ? `, kept as scaled (mf ${r.carrierSpan.p}/${r.carrierSpan.q}, figures over ${r.carrierSpan.q} periods)` : ', rounded to a whole mf'}`),
  },
  {
    heading: 'mf',
    // A carrier that is no whole multiple: the ratio p/q its report is exact over (q periods).
    cell: (r) =>
      r.carrierSpan
        ? `${r.carrierSpan.p}/${r.carrierSpan.q}`
        : r.frequencyRatio === null
          ? '—'
          : formatNumber(r.frequencyRatio),
    value: (r) => r.frequencyRatio,
    title: (r) =>
      r.carrierSpan
        ? `≈ ${formatNumber(r.frequencyRatio ?? 0, 6)}, figures over ${r.carrierSpan.q} fundamental periods; carrier analysed ${formatNumber(r.carrierSpan.carrierFrequency, 9)} Hz`
        : r.frequencyRatio === null
          ? 'a stored pattern has no carrier'
          : 'carrier ÷ fundamental',
  },
  {
    heading: 'Switching loss (W)',
    cell: (r) => (r.losses ? formatNumber(r.losses.switching) : '—'),
    value: (r) => r.losses?.switching ?? null,
    title: (r) => (r.losses ? `all devices; total ${formatNumber(r.losses.total)} W` : 'no device'),
  },
  {
    heading: 'Efficiency',
    cell: (r) => (r.losses?.efficiency != null ? formatPercent(r.losses.efficiency, 3) : '—'),
    value: (r) => r.losses?.efficiency ?? null,
    title: (r) => (r.losses ? 'semiconductor losses only' : 'no device'),
  },
  {
    heading: 'Fundamental (V peak)',
    cell: (r) => formatNumber(r.bridge.fundamental),
    value: (r) => r.bridge.fundamental,
    title: (r) => r.bridge.name,
  },
  {
    heading: 'THD, exact',
    cell: (r) => formatPercent(r.bridge.thd),
    value: (r) => r.bridge.thd,
    title: (r) => `whole waveform, ${r.bridge.name}`,
  },
  {
    heading: 'WTHD, exact',
    cell: (r) => formatPercent(r.bridge.wthd, 3),
    value: (r) => r.bridge.wthd,
    title: (r) => `whole waveform, ${r.bridge.name}`,
  },
  {
    heading: 'Output THD',
    cell: (r) => (r.output ? formatPercent(r.output.thd) : '—'),
    value: (r) => r.output?.thd ?? null,
    title: (r) => (r.output ? `${r.output.name}, to order ${r.analysisOrder}` : 'no filter'),
  },
  {
    heading: 'Current ripple (A rms)',
    cell: (r) => (phaseA(r) ? formatNumber(phaseA(r)?.inverter.rippleRms ?? Number.NaN) : '—'),
    value: (r) => phaseA(r)?.inverter.rippleRms ?? null,
    title: (r) => phaseA(r)?.inverter.name ?? 'no load or filter',
  },
  {
    heading: 'Switch current (A rms)',
    cell: (r) => (phaseA(r) ? formatNumber(phaseA(r)?.inverter.rms ?? Number.NaN) : '—'),
    value: (r) => phaseA(r)?.inverter.rms ?? null,
    title: (r) => phaseA(r)?.inverter.name ?? 'no load or filter',
  },
  {
    heading: 'Load power (W)',
    cell: (r) => (r.loadPower === null ? '—' : formatNumber(r.loadPower)),
    value: (r) => r.loadPower,
    title: (r) => (r.phaseCount === 3 ? 'into R, all three phases' : 'into R'),
  },
  {
    heading: 'Filter resonance (Hz)',
    // A grid design's is the LCL's (designResonance), marked as such, not L1 with C alone.
    cell: (r) => {
      const resonance = designResonance(r);
      if (!resonance) return '—';
      const value = formatNumber(resonance.frequency);
      return resonance.name === 'LCL resonance' ? `${value} (LCL)` : value;
    },
    value: (r) => designResonance(r)?.frequency ?? null,
    title: (r) => {
      const resonance = designResonance(r);
      if (resonance?.name === 'LCL resonance')
        return `${resonance.name}${resonance.distances ? `; ${resonance.distances}` : ''}`;
      return r.filter?.gainAtCarrier != null
        ? `gain at the carrier ${formatGain(r.filter.gainAtCarrier)}`
        : 'no filter';
    },
  },
  {
    heading: 'Grid current THD',
    cell: (r) => (r.grid ? formatPercent(r.grid.gridCurrentThd) : '—'),
    value: (r) => r.grid?.gridCurrentThd ?? null,
    title: (r) =>
      r.grid
        ? `phase a; IEEE 519 ${r.grid.limits.ieee519.pass ? 'within' : 'over'}, IEEE 1547 ${r.grid.limits.ieee1547.pass ? 'within' : 'over'} (limits recalled from memory)`
        : 'no grid',
  },
  {
    heading: 'Common mode (V rms)',
    cell: (r) => (r.commonMode ? formatNumber(r.commonMode.rms) : '—'),
    value: (r) => r.commonMode?.rms ?? null,
    title: (r) =>
      r.commonMode
        ? `levels ${r.commonMode.levels.map((l) => formatNumber(l)).join(', ')} V; ${formatNumber(r.commonMode.stepsPerPeriod, 6)} steps a period`
        : 'single-phase bridge',
  },
  {
    heading: 'Device switching (Hz)',
    cell: (r) => (r.switching ? formatNumber(r.switching.averageDeviceFrequency) : '—'),
    value: (r) => r.switching?.averageDeviceFrequency ?? null,
    title: (r) =>
      r.switching
        ? `turn-ons of each switch per second, averaged over the period (${formatNumber(r.switching.legEdgesPerPeriod, 6)} leg edges a period)`
        : 'no switching figure (a staircase pattern)',
  },
  {
    heading: 'Limit check',
    cell: (r) => (r.limitCheck.pass ? 'pass' : 'fail'),
    title: (r) => `${r.limitCheck.standard.name}, ${limitPointName(r)}`,
  },
];
