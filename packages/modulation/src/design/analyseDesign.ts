import { assertLcFilter } from '../filter/assertLcFilter.js';
import type { OutputNetwork } from '../filter/outputNetworkResponse.js';
import { outputNetworkTransfer } from '../filter/outputNetworkTransfer.js';
import { checkVoltageHarmonicLimits } from '../limits/checkVoltageHarmonicLimits.js';
import { GRID_CURRENT_LIMIT_CAUTION } from '../limits/gridCurrentLimits.js';
import { HARMONIC_LIMIT_CAUTION } from '../limits/voltageHarmonicLimits.js';
import { motorLoadFigures } from '../load/motorLoadFigures.js';
import type { RlLoadOptions } from '../load/RlLoad.js';
import { TAU } from '../math.js';
import { phasorOf, type Complex } from '../numeric/complex.js';
import { reducedCommonModeRange } from '../three-phase/reducedCommonModeRange.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import type { Waveform } from '../waveform/Waveform.js';
import { assertInverterDesign } from './assertInverterDesign.js';
import { analyseDesignSpan } from './analyseDesignSpan.js';
import { designCarrierSpan } from './designCarrierSpan.js';
import { defaultSpectrumOrder } from './defaultSpectrumOrder.js';
import { designModulation } from './designModulation.js';
import { commonModeFigures } from './commonModeFigures.js';
import { dcLinkFigures } from './dcLinkFigures.js';
import { designLosses } from './designLosses.js';
import { filterFigures } from './filterFigures.js';
import { gridFigures } from './gridFigures.js';
import { gridLoad } from './gridLoad.js';
import type {
  CommonModeFigures,
  CurrentFigures,
  DesignReport,
  PhaseCurrents,
} from './DesignReport.js';
import type { InverterDesign } from './InverterDesign.js';
import { MODULATION_METHOD_LABELS } from './Modulation.js';
import { modulationVoltages, type NamedVoltage } from './modulationVoltages.js';
import { spectrumLabelRatio } from './spectrumLabelRatio.js';
import { designVoltagePhasors } from './designVoltagePhasors.js';
import { exactLoadCurrents } from './exactLoadCurrents.js';
import { filteredPhase, outputSeriesSize, type FilteredPhase } from './filteredPhase.js';
import { labelledVoltageFigures } from './labelledVoltageFigures.js';
import { modulatorSignals } from './modulatorSignals.js';
import { multilevelDcLinkSwitching } from './multilevelDcLinkSwitching.js';
import { multilevelFigures } from './multilevelFigures.js';
import { switchingLegs } from './switchingLegs.js';
import { hasAntisymmetricHalves } from '../waveform/waveformSymmetry.js';
import { assertSemiconductorDevice } from '../losses/assertSemiconductorDevice.js';
import { designReportPlans, type DesignReportPlans } from './designReportPlans.js';
import { synthesisSize } from './periodSynthesiser.js';

/** Options of {@link analyseDesign}. */
export interface AnalyseDesignOptions {
  /** Highest order of the returned spectra, integer in [50, 5000]. @default defaultSpectrumOrder(design) */
  maxOrder?: number;
  /**
   * Samples per period of the returned time series (charts), integer in [64, 20000]; a filtered
   * design's series hold at most as many as its figures were read on. No figure depends on it.
   * @default 1200
   */
  points?: number;
  /**
   * Nominal bus voltage at the point of coupling for the limit check, volts rms line to line.
   * @default the rms line-to-line fundamental of the voltage checked
   */
  busVoltage?: number;
  /**
   * Transform plans to reuse (`designReportPlans`): a caller making many reports on one thread
   * (a worker, a sweep) keeps one set and saves building the transforms' tables (0.65 ms of 8 at
   * mf 101 with a filter) and the spectra's label table (0.2 ms) each report. The figures are the
   * same without them.
   * @default none: each report builds its own
   */
  plans?: DesignReportPlans;
}

/** Most samples a period of the unfiltered currents is read on (a power of two). */
const MAX_GRID_SAMPLES = 1 << 17;

/**
 * Fewest samples a period the figures read (peaks, ripple peak-to-peak, DC-link current). The
 * grid depends on the design alone, never on `points`, so a report asked for with fewer chart
 * samples (Compare) gives the same figures as the editor's.
 */
const MIN_GRID_SAMPLES = 4096;

/** Most orders summed for a filtered design (bounds its cost; the tail beyond is bounded, not dropped). */
export const MAX_ANALYSIS_ORDER = 20_000;

/** The general caution shown with every report (docs/references.md). */
export const DESIGN_CAUTION =
  'Inverter DC buses and outputs are lethal. These predictions are idealised (ideal switches, no dead time or losses unless ' +
  'a model is chosen) and are no substitute for measurement, protective design, and the codes and licensed practice that ' +
  'apply where the equipment is built and installed.';

const PHASES = ['a', 'b', 'c'] as const;

/** What a current's name adds for its phase: `, phase a` of a three-phase bridge, nothing for a single-phase one. */
const phaseSuffix = (phaseCount: number, phase: PhaseCurrents['phase']): string =>
  phaseCount === 3 ? `, phase ${phase}` : '';

/**
 * The design report: every figure the product shows for one {@link InverterDesign}, from one
 * model, so the editor, Compare, the limit check, the printed report, the API and the command
 * line agree to the last digit.
 *
 * - Voltages: the bridge's output voltages, exact from the switching angles; THD and WTHD of the
 *   bridge voltages over the whole waveform (`waveformThd`, `waveformWthd`), the spectrum to
 *   `maxOrder` labelled by carrier group.
 * - With a filter: each phase's LC filter loaded by its load, solved per harmonic
 *   (`outputNetworkResponse`) to `analysisOrder` = min(20000, max(maxOrder, 10·mf + 10)) (2000
 *   for a pattern); the output's THD beyond that order is bounded by Parseval: the bridge's
 *   remaining mean square (exact) times the largest filter gain found above the order (|H| is
 *   sampled at (N+1)·2^k, k = 0..10, and assumed not to rise between: true past the resonance).
 * - Currents per phase: without a filter the exact piecewise-exponential steady state
 *   (`rlSteadyState`); with one the harmonic sum to the current order
 *   min(20000, max(defaultSpectrumOrder(design), 10·mf + 10)), which depends on the design only
 *   (so every figure is the same at any `maxOrder`), plus the switching tail above it where the
 *   filter's inductor alone sets the current; its time series by FFT. Ripple is i − i₁.
 * - Three-phase: the load and filter are star-connected and balanced; each phase sees its
 *   phase-to-star-point voltage (2·v_a − v_b − v_c)/3; line-to-line figures are reported beside.
 *   The three currents then sum to zero (Kirchhoff at the star point), so with a filter phase
 *   c's sampled currents are minus a's and b's (equal to rounding), its phasors its own.
 * - Limit check (IEEE Std 519-2022 Table 1, recalled from memory) on the voltage at the point
 *   of coupling: the filter's output with a filter, else the bridge's.
 * - With a `device`: the semiconductor losses of each leg's devices (`designLosses`) from the
 *   phase currents above and the exact leg waveforms, with the output power and efficiency.
 * - With a `grid`: the grid is each phase's load (r, l2 + l, the grid source as its EMF; see
 *   `gridLoad`), and `grid` holds the grid-connected figures (`gridFigures`: grid and inverter
 *   current spectra, resonance, damping loss, the current limits of IEEE Std 519 and 1547).
 * - A carrier that is no whole multiple of the fundamental (sine-triangle, three-phase carrier,
 *   space vector): every figure over the span of q periods of its nearest ratio p/q, stated in
 *   `carrierSpan` (`analyseDesignSpan`, with a filter or grid too, bounded by `designSpanMaxOrder`).
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field by its path in the design
 *   (`vdc`, `carrierFrequency`, `modulation.ma`, `load.r`, `filter.c`, …) or the option
 */
export function analyseDesign(
  given: InverterDesign,
  options: AnalyseDesignOptions = {},
): DesignReport {
  assertInverterDesign(given);
  const { maxOrder = defaultSpectrumOrder(given), points = 1200, busVoltage } = options;
  assertNumberInRange('maxOrder', maxOrder, { min: 50, max: 5000, integer: true });
  assertNumberInRange('points', points, { min: 64, max: 20_000, integer: true });
  if (busVoltage !== undefined)
    assertNumberInRange('busVoltage', busVoltage, { min: 0, minExclusive: true, max: 1e7 });
  const filter = given.filter ?? null;
  if (filter !== null) withFieldPrefix('filter.', () => assertLcFilter(filter));
  const device = given.device ?? null;
  if (device !== null) assertSemiconductorDevice(device);
  // A carrier that is no whole multiple of the fundamental: every figure over its span of q periods.
  const span = designCarrierSpan(given);
  if (span !== null)
    return analyseDesignSpan(given, span, {
      ...(options.maxOrder === undefined ? {} : { maxOrder }),
      points,
      ...(busVoltage === undefined ? {} : { busVoltage }),
      caution: DESIGN_CAUTION,
    });
  const modulation = withFieldPrefix('modulation.', () => designModulation(given));
  const voltages = withFieldPrefix('modulation.', () => modulationVoltages(modulation));
  // A grid is the load of each phase: r and l2 + l with the grid source as its EMF.
  const grid = given.grid ?? null;
  const design: InverterDesign =
    grid === null ? given : { ...given, load: gridLoad(grid, voltages.phaseCount) };
  const frequencyRatio =
    'mf' in modulation
      ? modulation.mf
      : 'frequencyRatio' in modulation
        ? modulation.frequencyRatio
        : null;
  const labelRatio = spectrumLabelRatio(maxOrder, frequencyRatio);
  const analysisOrder =
    filter === null
      ? maxOrder
      : Math.min(MAX_ANALYSIS_ORDER, Math.max(maxOrder, 10 * (frequencyRatio ?? 200) + 10));
  // The filtered currents are summed to an order set by the design alone, not by the spectrum
  // asked for, so their figures are the same at any maxOrder (the switching tail covers the rest).
  const currentOrder = Math.min(
    MAX_ANALYSIS_ORDER,
    Math.max(defaultSpectrumOrder(given), 10 * (frequencyRatio ?? 200) + 10),
  );
  // Every spectrum is labelled from one table, and every voltage read once (see designVoltagePhasors).
  // The caller's plans, or plans of this report's own (the same transforms, built here).
  const plans = options.plans ?? designReportPlans();
  const labeller = plans.labeller(maxOrder, labelRatio);
  const label = labeller.harmonics;
  const spectra = designVoltagePhasors(
    voltages,
    filter === null ? maxOrder : Math.max(analysisOrder, currentOrder),
  );

  const phaseVoltages = voltages.phases.map((v) => v.waveform);
  const bridge = labelledVoltageFigures(
    voltages.phases[0] as NamedVoltage,
    labeller.phasors(spectra.phase(0)),
  );
  const line = voltages.lines[0];
  const lineToLine = line ? labelledVoltageFigures(line, labeller.phasors(spectra.line(0))) : null;
  const load = design.load ?? null;
  const frequency = design.fundamentalFrequency;
  const network: OutputNetwork = { filter, load: load === null ? null : { r: load.r, l: load.l } };

  let output: DesignReport['output'] = null;
  let currents: PhaseCurrents[] = [];
  let loadPower: number | null = null;
  let inverterSamples: Float64Array[] = [];
  // One transform for every sampled series of a filtered design (and its DC-link spectrum).
  const synthesiser =
    filter === null
      ? null
      : plans.synthesiser(
          synthesisSize(currentOrder, Math.max(MIN_GRID_SAMPLES, 16 * currentOrder)),
        );
  if (synthesiser === null) {
    if (load !== null) {
      const solved = exactLoadCurrents(
        phaseVoltages.map((waveform, k) => ({
          waveform,
          load: rlLoadOf(design, k),
          phase: PHASES[k] ?? 'a',
          suffix: phaseSuffix(voltages.phaseCount, PHASES[k] ?? 'a'),
        })),
        {
          // The ripple's extremes sit at or near the switching edges: every edge and a fine grid.
          gridSize: synthesisSize(
            1,
            Math.min(MAX_GRID_SAMPLES, Math.max(MIN_GRID_SAMPLES, 64 * (frequencyRatio ?? 64))),
          ),
          points,
        },
      );
      currents = solved.map((s) => s.currents);
      loadPower = solved.reduce((sum, s) => sum + s.power, 0);
      inverterSamples = solved.map((s) => s.inverterSamples);
    }
  } else {
    const omega = TAU * frequency;
    // The phases share one network: its response to each order is solved once for all three.
    // Its currents are read to the current order only (the output to the analysis order).
    const transfer = outputNetworkTransfer(
      network,
      omega,
      Math.max(analysisOrder, currentOrder),
      currentOrder,
    );
    // Phase a's output voltage is drawn only: its series has a grid of its own, of the chart's size.
    const outputSynthesiser = plans.synthesiser(
      outputSeriesSize(currentOrder, points, synthesiser.size),
    );
    const solved: FilteredPhase[] = [];
    phaseVoltages.forEach((waveform, k) => {
      const [a, b] = solved;
      // Phases b and c are read to the current order only (their spectrumOrder below).
      const read = filteredPhase(waveform, spectra.phase(k, k === 0 ? undefined : currentOrder), {
        network,
        transfer,
        omega,
        emf: emfPhasorOf(design, k),
        loadR: load === null ? null : load.r,
        phase: PHASES[k] ?? 'a',
        suffix: phaseSuffix(voltages.phaseCount, PHASES[k] ?? 'a'),
        // Phase a's output spectrum is reported to the analysis order; b and c give currents only.
        outputName:
          k === 0
            ? `filter output, ${voltages.phaseCount === 3 ? 'phase a to star point' : 'across the capacitor'}`
            : null,
        spectrumOrder: k === 0 ? analysisOrder : currentOrder,
        currentOrder,
        points,
        synthesiser,
        outputSynthesiser,
        labeller,
        // Phase c's currents are minus a's and b's (Kirchhoff at the star point).
        ...(voltages.phaseCount === 3 && k === 2 && a && b ? { others: [a, b] as const } : {}),
      });
      solved.push(read);
    });
    output = (solved[0] as FilteredPhase).output;
    currents = solved.map((s) => s.currents);
    loadPower = load === null ? null : solved.reduce((sum, s) => sum + s.loadPower, 0);
    inverterSamples = solved.map((s) => s.inverterSamples);
  }
  // With a grid the load's current is the grid's: named so (by phase on a three-phase bridge only).
  if (grid !== null)
    currents = currents.map((c) => ({
      ...c,
      load: c.load && {
        ...c.load,
        name: `grid current${phaseSuffix(voltages.phaseCount, c.phase)}`,
      },
    }));
  // Whether each phase's current repeats negated half a period on, read once for the DC link and
  // the losses.
  const antisymmetricCurrents = inverterSamples.map(hasAntisymmetricHalves);
  // The switching function of each leg: a two-level leg's upper switch is on at +vdc/2; a
  // single-phase bridge draws (v_bridge/vdc)·i. A staircase has a source per cell: no one DC link.
  const staircase = 'kind' in design.modulation && design.modulation.kind === 'staircase';
  const switching =
    voltages.phaseCount === 3
      ? voltages.legs.map((v) => v.waveform)
      : voltages.phases.map((v) => v.waveform);
  // A multilevel bridge has one DC current only with flying-capacitor legs (see
  // multilevelDcLinkSwitching); the others' DC sides are in the multilevel balance figures.
  const dcSwitching =
    voltages.multilevel === undefined
      ? switching
      : multilevelDcLinkSwitching(voltages.multilevel, design.vdc);
  const dcLink =
    inverterSamples.length === 0 || staircase || dcSwitching === null
      ? null
      : dcLinkFigures(dcSwitching, inverterSamples, {
          vdc: design.vdc,
          phaseCount: voltages.phaseCount,
          maxOrder,
          points,
          label,
          labelPhasors: labeller.phasors,
          transform: (size) => plans.transform(size),
          antisymmetricCurrents,
        });
  const commonMode =
    voltages.commonMode !== null
      ? commonModeFigures(voltages.commonMode, {
          maxOrder,
          frequencyRatio,
          label,
          spectrum: labeller.phasors(spectra.commonMode()),
          reducedRange: reducedRangeOf(design),
          name:
            voltages.multilevel?.topology === 'cascaded-h-bridge'
              ? "common mode, star point to the strings' neutral"
              : 'common mode, star point to DC midpoint',
        })
      : null;
  const multilevel =
    voltages.multilevel === undefined
      ? null
      : multilevelFigures(modulation, voltages.multilevel, {
          fundamentalFrequency: frequency,
          currents: inverterSamples,
          vdc: design.vdc,
          device,
        });
  const legA = voltages.legs[0];
  // The two-level legs (a single-phase bridge's too, read from its output); null for a staircase.
  const legs = switchingLegs(modulation, voltages, design.vdc);
  const singlePhaseLeg = voltages.phaseCount === 1 ? legs?.[0] : undefined;
  const legSwitching =
    multilevel !== null
      ? {
          legEdgesPerPeriod: multilevel.legs[0]?.edgesPerPeriod ?? 0,
          averageDeviceFrequency: multilevel.averageDeviceFrequency,
        }
      : legA !== undefined
        ? {
            legEdgesPerPeriod: legA.waveform.edges.length,
            averageDeviceFrequency: (legA.waveform.edges.length / 2) * frequency,
          }
        : singlePhaseLeg !== undefined
          ? legEdgeFigures(singlePhaseLeg.state, frequency)
          : null;

  const losses =
    legs === null || device === null || dcLink === null
      ? null
      : designLosses(legs, inverterSamples, {
          device,
          vdc: design.vdc,
          fundamentalFrequency: frequency,
          outputPower: design.vdc * dcLink.mean,
          antisymmetricCurrents,
        });

  const pcc = output ?? bridge;
  const pccSpectrum = output === null ? bridge.spectrum : output.spectrum;
  const nominal = ((voltages.phaseCount === 3 ? Math.sqrt(3) : 1) * pcc.fundamental) / Math.SQRT2;
  const limitCheck = checkVoltageHarmonicLimits(pccSpectrum, {
    busVoltage: busVoltage ?? nominal,
    thdWholeWaveform: pcc.thdUpperBound,
  });

  return {
    method: design.modulation.method,
    methodLabel: MODULATION_METHOD_LABELS[design.modulation.method],
    phaseCount: voltages.phaseCount,
    frequencyRatio,
    fundamentalFrequency: frequency,
    maxOrder,
    analysisOrder,
    voltages: [...voltages.phases, ...voltages.legs, ...voltages.lines],
    modulator: modulatorSignals(modulation, points),
    bridge,
    lineToLine,
    output,
    currents,
    dcLink,
    commonMode,
    switching: legSwitching,
    multilevel,
    loadPower,
    losses,
    motor:
      grid === null && load?.emf && load.emf.amplitude > 0
        ? motorLoadFigures(
            currents.map((c) => ({ ...(c.load as CurrentFigures), phase: c.phase })),
            load.emf,
            frequency,
          )
        : null,
    filter: filter === null ? null : filterFigures(filter, network, frequency, frequencyRatio),
    limitCheck,
    grid:
      grid === null
        ? null
        : gridFigures({
            grid,
            network,
            bridge: spectra.phase(0),
            analysisOrder,
            source: phasorOf(load?.emf?.amplitude ?? 0, load?.emf?.phase ?? 0),
            phaseCount: voltages.phaseCount,
            fundamentalFrequency: frequency,
            carrierFrequency: frequencyRatio === null ? null : frequencyRatio * frequency,
            gridCurrentThdWholeWaveform: currents[0]?.load?.thd ?? 0,
            labeller,
          }),
    cautions:
      grid === null
        ? [DESIGN_CAUTION, HARMONIC_LIMIT_CAUTION]
        : [DESIGN_CAUTION, HARMONIC_LIMIT_CAUTION, GRID_CURRENT_LIMIT_CAUTION],
  };
}

/** How often a two-level leg's switches turn on, from its upper-switch state (a constant one: never). */
function legEdgeFigures(
  state: Waveform,
  frequency: number,
): NonNullable<DesignReport['switching']> {
  const edges = state.levels.length > 1 ? state.edges.length : 0;
  return { legEdgesPerPeriod: edges, averageDeviceFrequency: (edges / 2) * frequency };
}

/** The reduced common-mode range of a three-phase carrier design's zero sequence, else null. */
function reducedRangeOf(design: InverterDesign): CommonModeFigures['reducedRange'] {
  const { modulation } = design;
  return modulation.method === 'three-phase'
    ? reducedCommonModeRange(modulation.zeroSequence ?? 'none')
    : null;
}

/** This phase's back-EMF phasor at the fundamental (zero without one): the EMF lags by k·2π/3. */
function emfPhasorOf(design: InverterDesign, phaseIndex: number): Complex {
  const emf = design.load?.emf ? rlLoadOf(design, phaseIndex).emf : undefined;
  return emf ? phasorOf(emf.amplitude, emf.phase) : { re: 0, im: 0 };
}

/** The load of phase k (0, 1, 2) as rlSteadyState takes it: the EMF lags by k·2π/3. */
function rlLoadOf(design: InverterDesign, phaseIndex: number): RlLoadOptions {
  const load = design.load as NonNullable<InverterDesign['load']>;
  const emf = load.emf
    ? { amplitude: load.emf.amplitude, phase: load.emf.phase - (phaseIndex * TAU) / 3 }
    : undefined;
  return { r: load.r, l: load.l, frequency: design.fundamentalFrequency, ...(emf ? { emf } : {}) };
}
