import { checkVoltageHarmonicLimits } from '../limits/checkVoltageHarmonicLimits.js';
import { HARMONIC_LIMIT_CAUTION } from '../limits/voltageHarmonicLimits.js';
import { motorLoadFigures } from '../load/motorLoadFigures.js';
import { TAU } from '../math.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
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
import type { InverterDesign } from './InverterDesign.js';
import { labelSpanHarmonics, type SpanLabelledHarmonic } from './labelSpanHarmonics.js';
import { MODULATION_METHOD_LABELS } from './Modulation.js';
import { modulationVoltages, type NamedVoltage } from './modulationVoltages.js';
import { modulatorSignals } from './modulatorSignals.js';
import { synthesisSize } from './periodSynthesiser.js';
import { spanLoadCurrents } from './spanLoadCurrents.js';
import { switchingLegs } from './switchingLegs.js';

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
 * - DC link, common mode, switching counts and losses: the one-period functions run over the
 *   span at the span frequency f₁/q, their per-period counts divided by q (per second they need
 *   no change).
 * - Limit check (IEEE Std 519-2022, from memory): the integer orders against the table; the
 *   sub- and inter-harmonics count in the whole-waveform THD.
 * - Refused: a filter or a grid (solved per harmonic of one period; not generalised here).
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

  const load = design.load ?? null;
  const gridSize = synthesisSize(
    1,
    Math.min(MAX_SPAN_SAMPLES, Math.max(MIN_SAMPLES_PER_PERIOD * q, 64 * p)),
  );
  const solved =
    load === null
      ? []
      : voltages.phases.map((voltage, k) =>
          spanLoadCurrents(
            voltage.waveform,
            {
              r: load.r,
              l: load.l,
              frequency,
              ...(load.emf
                ? {
                    emf: {
                      amplitude: load.emf.amplitude,
                      phase: load.emf.phase - (k * TAU) / 3,
                    },
                  }
                : {}),
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
  const currents: PhaseCurrents[] = solved.map((s) => s.currents);
  const inverterSamples = solved.map((s) => s.inverterSamples);
  const loadPower = load === null ? null : solved.reduce((sum, s) => sum + s.power, 0);

  const switching =
    voltages.phaseCount === 3
      ? voltages.legs.map((v) => v.waveform)
      : voltages.phases.map((v) => v.waveform);
  const dcLinkSpan =
    inverterSamples.length === 0
      ? null
      : dcLinkFigures(switching, inverterSamples, {
          vdc: design.vdc,
          phaseCount: voltages.phaseCount,
          maxOrder: q * maxOrder,
          points,
          label,
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
    voltages.phaseCount === 3
      ? commonModeFigures(
          voltages.legs.map((v) => v.waveform),
          {
            maxOrder: q * maxOrder,
            frequencyRatio: p,
            label,
            reducedRange:
              modulation.method === 'three-phase'
                ? reducedCommonModeRange(modulation.zeroSequence ?? 'none')
                : null,
            name: 'common mode, star point to DC midpoint',
          },
        )
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
        });

  // A back-EMF's torque-producing current and air-gap power, from the span's fundamentals.
  const emf = load?.emf;
  const loadFundamentals = currents.map((c) => ({ ...(c.load as CurrentFigures), phase: c.phase }));
  const motor =
    emf !== undefined && emf.amplitude > 0
      ? motorLoadFigures(loadFundamentals, emf, frequency)
      : null;

  const nominal =
    ((voltages.phaseCount === 3 ? Math.sqrt(3) : 1) * bridge.fundamental) / Math.SQRT2;
  const limitCheck = checkVoltageHarmonicLimits(
    (bridge.spectrum as SpanLabelledHarmonic[]).filter((h) => h.kind === 'harmonic'),
    { busVoltage: busVoltage ?? nominal, thdWholeWaveform: bridge.thdUpperBound },
  );

  return {
    method: design.modulation.method,
    methodLabel: MODULATION_METHOD_LABELS[design.modulation.method],
    phaseCount: voltages.phaseCount,
    frequencyRatio: ratio,
    fundamentalFrequency: frequency,
    maxOrder,
    analysisOrder: maxOrder,
    voltages: [...voltages.phases, ...voltages.legs, ...voltages.lines],
    modulator: modulatorSignals(modulation, points),
    bridge,
    lineToLine,
    output: null,
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
    filter: null,
    limitCheck,
    grid: null,
    cautions: [options.caution, HARMONIC_LIMIT_CAUTION],
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
  let shown = 0;
  for (const c of read.components)
    if (c.spanOrder !== 0 && c.spanOrder !== q) shown += c.amplitude * c.amplitude;
  return {
    name: voltage.name,
    fundamental: read.fundamental,
    fundamentalPhase: read.fundamentalPhase,
    rms: Math.sqrt(waveformMeanSquare(voltage.waveform)),
    thd: read.thd,
    thdUpperBound: read.thd,
    wthd: read.wthd,
    exact: true,
    spectrum: label(
      read.components.map((c) => ({ order: c.spanOrder, amplitude: c.amplitude, phase: c.phase })),
    ),
    spectrumThd: Math.sqrt(shown) / read.fundamental,
  };
}
