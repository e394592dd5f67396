import type { OutputNetwork } from '../filter/outputNetworkResponse.js';
import { outputNetworkTransfer } from '../filter/outputNetworkTransfer.js';
import { checkVoltageHarmonicLimits } from '../limits/checkVoltageHarmonicLimits.js';
import { GRID_CURRENT_LIMIT_CAUTION } from '../limits/gridCurrentLimits.js';
import { HARMONIC_LIMIT_CAUTION } from '../limits/voltageHarmonicLimits.js';
import { motorLoadFigures } from '../load/motorLoadFigures.js';
import { TAU } from '../math.js';
import { phasorOf } from '../numeric/complex.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { harmonicsOfPhasors } from '../spectrum/harmonicsOfPhasors.js';
import { subharmonicSpectrum } from '../spectrum/subharmonicSpectrum.js';
import { reducedCommonModeRange } from '../three-phase/reducedCommonModeRange.js';
import { ParameterRangeError } from '../validation/errors.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';
import { MAX_ASYNCHRONOUS_COST } from './asynchronousDesignSpectra.js';
import { commonModeFigures } from './commonModeFigures.js';
import { dcLinkFigures } from './dcLinkFigures.js';
import { defaultSpectrumOrder } from './defaultSpectrumOrder.js';
import type {
  CurrentFigures,
  DesignReport,
  PhaseCurrents,
  VoltageFigures,
} from './DesignReport.js';
import { designLosses } from './designLosses.js';
import type { RationalRatio } from './designRationalRatio.js';
import { designSpanMaxOrder } from './designSpanMaxOrder.js';
import { designSpanModulation } from './designSpanModulation.js';
import { designVoltagePhasors } from './designVoltagePhasors.js';
import { filteredPhase, outputSeriesSize, type FilteredPhase } from './filteredPhase.js';
import { filterFigures } from './filterFigures.js';
import { gridFigures } from './gridFigures.js';
import { gridLoad } from './gridLoad.js';
import type { InverterDesign } from './InverterDesign.js';
import { labelSpanHarmonics, type SpanLabelledHarmonic } from './labelSpanHarmonics.js';
import { MODULATION_METHOD_LABELS } from './Modulation.js';
import { modulationVoltages, type NamedVoltage } from './modulationVoltages.js';
import { modulatorSignals } from './modulatorSignals.js';
import { periodSynthesiser, synthesisSize } from './periodSynthesiser.js';
import { spanFilterOrder } from './spanFilterOrder.js';
import { spanLoadCurrents } from './spanLoadCurrents.js';
import type { SpectrumLabeller } from './spectrumLabeller.js';
import { switchingLegs } from './switchingLegs.js';
import { hasAntisymmetricHalves } from '../waveform/waveformSymmetry.js';

/** Fewest grid samples a fundamental period of the span's currents (as the integer report's). */
const MIN_SAMPLES_PER_PERIOD = 4096;
/** Most grid samples over a span (a power of two; rlCurrentAt takes up to 1e6 angles). */
const MAX_SPAN_SAMPLES = 1 << 19;
const PHASES = ['a', 'b', 'c'] as const;

/**
 * The design report of a design whose carrier is not a whole multiple of the fundamental (the
 * branch `analyseDesign` takes for `designCarrierSpan`'s ratio p/q): every figure computed over
 * the span of q fundamental periods after which the pattern repeats (p carrier cycles), exact
 * where the one-period report is exact.
 *
 * - Voltages: built over the span (`modulationVoltages` with `fundamentalPeriods` q) and read by
 *   `subharmonicSpectrum`: components at n/q of the fundamental to `maxOrder`, labelled by
 *   carrier group and sideband (order = m·p/q + k, Holmes and Lipo, 2003, ch. 3) and by kind
 *   (harmonic, sub-harmonic, inter-harmonic; IEC 61000-4-7's terms, from memory, without its
 *   5 Hz grouping). THD and WTHD are over the whole span, every component but the mean and the
 *   fundamental, sub- and inter-harmonics included (exact, Parseval).
 * - Currents: the exact piecewise-exponential steady state over the span (`spanLoadCurrents`).
 * - With a filter: as the one-period report, each component of the span (order n of the base
 *   f₁/q) through the loaded network at its own frequency n·f₁/q (`filteredPhase` with the
 *   fundamental at order q, where the back-EMF or grid source drives it), to the span order
 *   q·max(maxOrder, ⌈10·p/q⌉ + 10) (`spanFilterOrder`), the currents summed over the span plus
 *   the switching tail, the output spectrum labelled as the span's others; the filter's gain at
 *   the carrier p/q·f₁.
 * - With a grid: the grid is each phase's load (`gridLoad`), and `grid` holds its figures over
 *   the span (`gridFigures` with the fundamental at order q): the limits of IEEE Std 519 and 1547
 *   by whole order are checked on IEC 61000-4-7's harmonic groups of the span's components
 *   (`harmonicGroups`, from memory; `grid.harmonicGrouping` lists what each group took).
 * - DC link, common mode, switching counts and losses: the one-period functions run over the
 *   span at the span frequency f₁/q, their per-period counts divided by q (per second they need
 *   no change).
 * - Limit check (IEEE Std 519-2022, from memory): the integer orders against the table; the
 *   sub- and inter-harmonics count in the whole-waveform THD.
 *
 * @param options.maxOrder - in [50, 5000] already; here also at most `designSpanMaxOrder`
 *   @default min(defaultSpectrumOrder(design), that bound)
 * @throws ParameterRangeError naming `carrierFrequency` (`designSpanMaxOrder`) or `maxOrder`
 * Internal: part of analyseDesign.
 */
export function analyseDesignSpan(
  design: InverterDesign,
  span: RationalRatio,
  options: { maxOrder?: number; points: number; busVoltage?: number; caution: string },
): DesignReport {
  const { p, q, error } = span;
  const frequency = design.fundamentalFrequency;
  const bound = designSpanMaxOrder(design, span);
  const { maxOrder = Math.min(defaultSpectrumOrder(design), bound), points, busVoltage } = options;
  if (maxOrder > bound)
    throw new ParameterRangeError(
      'maxOrder',
      `an integer in [50, ${bound}] for the ratio ${p}/${q} (q·maxOrder span components over ${p} carrier cycles: p·q·maxOrder ≤ ${MAX_ASYNCHRONOUS_COST})`,
      maxOrder,
    );
  const ratio = p / q;
  const spanFrequency = frequency / q;
  const modulation = withFieldPrefix('modulation.', () => designSpanModulation(design, ratio));
  const voltages = withFieldPrefix('modulation.', () =>
    modulationVoltages(modulation, { fundamentalPeriods: q }),
  );
  const label = (spectrum: readonly Harmonic[]): SpanLabelledHarmonic[] =>
    labelSpanHarmonics(spectrum.slice(0, q * maxOrder + 1), { p, q });
  const figuresOf = (voltage: NamedVoltage): VoltageFigures =>
    spanVoltageFigures(voltage, { q, maxOrder, label });
  const bridge = figuresOf(voltages.phases[0] as NamedVoltage);
  const line = voltages.lines[0];
  const lineToLine = line ? figuresOf(line) : null;

  // A grid is the load of each phase: r and l2 + l with the grid source as its EMF.
  const grid = design.grid ?? null;
  const filter = design.filter ?? null;
  const load = grid === null ? (design.load ?? null) : gridLoad(grid, voltages.phaseCount);
  const network: OutputNetwork = { filter, load: load === null ? null : { r: load.r, l: load.l } };
  // Span orders n are at n/q of the fundamental; order q is the fundamental.
  const analysisOrder = filter === null ? maxOrder : Math.max(maxOrder, spanFilterOrder(span));
  const currentOrder = Math.max(Math.min(defaultSpectrumOrder(design), bound), analysisOrder);
  const spectra =
    filter === null && grid === null
      ? null
      : designVoltagePhasors(
          voltages,
          q * Math.max(analysisOrder, filter === null ? 0 : currentOrder),
        );
  const labeller: SpectrumLabeller = {
    harmonics: label,
    phasors: (phasors) =>
      label(harmonicsOfPhasors(phasors, Math.min(phasors.re.length, q * maxOrder + 1))),
  };
  const emfOf = (k: number) =>
    load?.emf
      ? { amplitude: load.emf.amplitude, phase: load.emf.phase - (k * TAU) / 3 }
      : undefined;
  const gridSize = synthesisSize(
    1,
    Math.min(MAX_SPAN_SAMPLES, Math.max(MIN_SAMPLES_PER_PERIOD * q, 64 * p)),
  );
  const filtered =
    filter === null || spectra === null
      ? null
      : spanFilteredPhases(voltages, spectra, {
          network,
          q,
          base: (TAU * frequency) / q,
          emfOf,
          spectrumOrder: q * analysisOrder,
          currentOrder: q * currentOrder,
          points,
          labeller,
        });
  const solved =
    load === null || filtered !== null
      ? []
      : voltages.phases.map((voltage, k) =>
          spanLoadCurrents(
            voltage.waveform,
            {
              r: load.r,
              l: load.l,
              frequency,
              ...(load.emf ? { emf: emfOf(k) } : {}),
            },
            {
              fundamentalPeriods: q,
              phase: PHASES[k] ?? 'a',
              suffix: voltages.phaseCount === 3 ? `, phase ${PHASES[k] ?? 'a'}` : '',
              points,
              gridSize,
            },
          ),
        );
  const solvedCurrents: PhaseCurrents[] =
    filtered === null ? solved.map((s) => s.currents) : filtered.map((s) => s.currents);
  // With a grid the load's current is the grid's: named so (by phase on a three-phase bridge only).
  const currents =
    grid === null
      ? solvedCurrents
      : solvedCurrents.map((c) => ({
          ...c,
          load: c.load && {
            ...c.load,
            name: c.load.name.replace('load current', 'grid current'),
          },
        }));
  const inverterSamples =
    filtered === null
      ? solved.map((s) => s.inverterSamples)
      : filtered.map((s) => s.inverterSamples);
  const loadPower =
    load === null
      ? null
      : filtered === null
        ? solved.reduce((sum, s) => sum + s.power, 0)
        : filtered.reduce((sum, s) => sum + s.loadPower, 0);
  const output = filtered === null ? null : (filtered[0] as FilteredPhase).output;
  if (output !== null) output.spectrumThd = shownThd(output.spectrum);

  const switching =
    voltages.phaseCount === 3
      ? voltages.legs.map((v) => v.waveform)
      : voltages.phases.map((v) => v.waveform);
  // Whether each phase's current repeats negated half the span on, read once for the DC link and
  // the losses.
  const antisymmetricCurrents = inverterSamples.map(hasAntisymmetricHalves);
  const dcLinkSpan =
    inverterSamples.length === 0
      ? null
      : dcLinkFigures(switching, inverterSamples, {
          vdc: design.vdc,
          phaseCount: voltages.phaseCount,
          maxOrder: q * maxOrder,
          points,
          label,
          antisymmetricCurrents,
        });
  const dcLink =
    dcLinkSpan === null
      ? null
      : {
          ...dcLinkSpan,
          secondHarmonic:
            voltages.phaseCount === 1
              ? (dcLinkSpan.spectrum.find((h) => h.order === 2)?.amplitude ?? 0)
              : null,
          samplesPerPeriod: dcLinkSpan.samplesPerPeriod / q,
        };
  const commonModeSpan =
    voltages.commonMode !== null
      ? commonModeFigures(voltages.commonMode, {
          maxOrder: q * maxOrder,
          frequencyRatio: p,
          label,
          reducedRange:
            modulation.method === 'three-phase'
              ? reducedCommonModeRange(modulation.zeroSequence ?? 'none')
              : null,
          name: 'common mode, star point to DC midpoint',
        })
      : null;
  const commonMode =
    commonModeSpan === null
      ? null
      : { ...commonModeSpan, stepsPerPeriod: commonModeSpan.stepsPerPeriod / q };

  const legs = switchingLegs(modulation, voltages, design.vdc);
  const legA = voltages.legs[0]?.waveform ?? legs?.[0]?.state;
  const legEdges = legA === undefined || legA.levels.length < 2 ? 0 : legA.edges.length;
  const device = design.device ?? null;
  const losses =
    legs === null || device === null || dcLink === null
      ? null
      : designLosses(legs, inverterSamples, {
          device,
          vdc: design.vdc,
          fundamentalFrequency: spanFrequency,
          outputPower: design.vdc * dcLink.mean,
          antisymmetricCurrents,
        });

  // A back-EMF's torque-producing current and air-gap power, from the span's fundamentals.
  const emf = load?.emf;
  const loadFundamentals = currents.map((c) => ({ ...(c.load as CurrentFigures), phase: c.phase }));
  const motor =
    grid === null && emf !== undefined && emf.amplitude > 0
      ? motorLoadFigures(loadFundamentals, emf, frequency)
      : null;

  // The limit check reads the voltage at the point of coupling: the filter's output, else the bridge's.
  const pcc = output ?? bridge;
  const nominal = ((voltages.phaseCount === 3 ? Math.sqrt(3) : 1) * pcc.fundamental) / Math.SQRT2;
  const limitCheck = checkVoltageHarmonicLimits(
    (pcc.spectrum as SpanLabelledHarmonic[]).filter((h) => h.kind === 'harmonic'),
    { busVoltage: busVoltage ?? nominal, thdWholeWaveform: pcc.thdUpperBound },
  );

  return {
    method: design.modulation.method,
    methodLabel: MODULATION_METHOD_LABELS[design.modulation.method],
    phaseCount: voltages.phaseCount,
    frequencyRatio: ratio,
    fundamentalFrequency: frequency,
    analysisOrder,
    maxOrder,
    voltages: [...voltages.phases, ...voltages.legs, ...voltages.lines],
    modulator: modulatorSignals(modulation, points),
    bridge,
    lineToLine,
    output,
    currents,
    dcLink,
    commonMode,
    switching: {
      legEdgesPerPeriod: legEdges / q,
      averageDeviceFrequency: (legEdges / 2) * spanFrequency,
    },
    multilevel: null,
    loadPower,
    losses,
    motor,
    filter: filter === null ? null : filterFigures(filter, network, frequency, ratio),
    limitCheck,
    grid:
      grid === null || spectra === null
        ? null
        : gridFigures({
            grid,
            network,
            bridge: spectra.phase(0),
            analysisOrder: q * analysisOrder,
            fundamentalOrder: q,
            source: phasorOf(load?.emf?.amplitude ?? 0, load?.emf?.phase ?? 0),
            phaseCount: voltages.phaseCount,
            fundamentalFrequency: frequency,
            carrierFrequency: ratio * frequency,
            gridCurrentThdWholeWaveform: currents[0]?.load?.thd ?? 0,
            labeller,
          }),
    cautions:
      grid === null
        ? [options.caution, HARMONIC_LIMIT_CAUTION]
        : [options.caution, HARMONIC_LIMIT_CAUTION, GRID_CURRENT_LIMIT_CAUTION],
    carrierSpan: {
      p,
      q,
      carrierFrequency: ratio * frequency,
      carrierError: error,
      baseFrequency: spanFrequency,
    },
  };
}

/**
 * A span's voltage as the report gives it: `subharmonicSpectrum`'s fundamental, THD and WTHD
 * over the whole span, its components labelled, and the THD of the shown components alone.
 */
function spanVoltageFigures(
  voltage: NamedVoltage,
  context: {
    q: number;
    maxOrder: number;
    label: (spectrum: readonly Harmonic[]) => SpanLabelledHarmonic[];
  },
): VoltageFigures {
  const { q, maxOrder, label } = context;
  const read = subharmonicSpectrum(voltage.waveform, { fundamentalPeriods: q, maxOrder });
  const spectrum = label(
    read.components.map((c) => ({ order: c.spanOrder, amplitude: c.amplitude, phase: c.phase })),
  );
  return {
    name: voltage.name,
    fundamental: read.fundamental,
    fundamentalPhase: read.fundamentalPhase,
    rms: Math.sqrt(waveformMeanSquare(voltage.waveform)),
    thd: read.thd,
    thdUpperBound: read.thd,
    wthd: read.wthd,
    exact: true,
    spectrum,
    spectrumThd: shownThd(spectrum),
  };
}

/** THD of the shown components of a span's spectrum: every one but the mean and the fundamental. */
function shownThd(spectrum: readonly Harmonic[]): number {
  let fundamental = 0;
  let shown = 0;
  for (const { order, amplitude } of spectrum)
    if (order === 1) fundamental = amplitude;
    else if (order !== 0) shown += amplitude * amplitude;
  return Math.sqrt(shown) / fundamental;
}

/**
 * Each phase of a span through its loaded filter (`filteredPhase` with the fundamental at span
 * order q and the base angular frequency ω₁/q): the network's unit responses solved once for
 * the span orders, the currents on one synthesis grid of at least 4096 samples a fundamental
 * period and 16 a cycle of the current order. Phase a gives the output's figures.
 */
function spanFilteredPhases(
  voltages: ReturnType<typeof modulationVoltages>,
  spectra: ReturnType<typeof designVoltagePhasors>,
  context: {
    network: OutputNetwork;
    q: number;
    base: number;
    emfOf: (k: number) => { amplitude: number; phase: number } | undefined;
    spectrumOrder: number;
    currentOrder: number;
    points: number;
    labeller: SpectrumLabeller;
  },
): FilteredPhase[] {
  const { network, q, base, emfOf, spectrumOrder, currentOrder, points, labeller } = context;
  const transfer = outputNetworkTransfer(network, base, Math.max(spectrumOrder, currentOrder));
  const synthesiser = periodSynthesiser(
    synthesisSize(currentOrder, Math.max(MIN_SAMPLES_PER_PERIOD * q, 16 * currentOrder)),
  );
  // Phase a's output voltage is drawn only: its series has a grid of its own, of the chart's size.
  const outputSynthesiser = periodSynthesiser(
    outputSeriesSize(currentOrder, points, synthesiser.size),
  );
  const three = voltages.phaseCount === 3;
  return voltages.phases.map((voltage, k) => {
    const phase = PHASES[k] ?? 'a';
    const emf = emfOf(k);
    return filteredPhase(voltage.waveform, spectra.phase(k), {
      network,
      transfer,
      omega: base,
      fundamentalOrder: q,
      emf: emf === undefined ? { re: 0, im: 0 } : phasorOf(emf.amplitude, emf.phase),
      loadR: network.load === null ? null : network.load.r,
      phase,
      suffix: three ? `, phase ${phase}` : '',
      outputName:
        k === 0
          ? `filter output, ${three ? 'phase a to star point' : 'across the capacitor'}`
          : null,
      spectrumOrder: k === 0 ? spectrumOrder : currentOrder,
      currentOrder,
      points,
      synthesiser,
      outputSynthesiser,
      labeller,
    });
  });
}
