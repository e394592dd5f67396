import type { LcFilterCharacteristics } from '../filter/lcFilter.js';
import type { GridCurrentLimitCheck } from '../limits/checkGridCurrentLimits.js';
import type { HarmonicLimitCheck } from '../limits/checkVoltageHarmonicLimits.js';
import type { HarmonicGroup } from '../limits/harmonicGroups.js';
import type { LegLosses } from '../losses/legLossesFromSamples.js';
import type { SemiconductorDevice } from '../losses/lossTypes.js';
import type { MotorFigures } from '../load/MotorFigures.js';
import type { CascadedCellPower } from '../multilevel/balance/cascadedCellPower.js';
import type { DeviceSwitching } from '../multilevel/balance/deviceSwitchingFrequencies.js';
import type { FlyingCapacitorCharge } from '../multilevel/balance/flyingCapacitorCharge.js';
import type { NeutralPointCurrentFigures } from '../multilevel/balance/neutralPointCurrentFigures.js';
import type { ThreeLevelLosses } from '../multilevel/losses/threeLevelLosses.js';
import type { ThreeLevelTrajectorySample } from '../multilevel/space-vector/threeLevelSpaceVectorTrajectory.js';
import type { ThreeLevelVectorDiagram } from '../multilevel/space-vector/threeLevelVectorDiagram.js';
import type {
  MultilevelCarrierArrangement,
  MultilevelTopology,
} from '../multilevel/MultilevelTypes.js';
import type { LabelledHarmonic } from '../spectrum/labelHarmonics.js';
import type { ReducedCommonModeRange } from '../three-phase/reducedCommonModeRange.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { ModulationMethod } from './Modulation.js';
import type { NamedVoltage } from './modulationVoltages.js';
import type { ModulatorSignals } from './modulatorSignals.js';

/** One period sampled at evenly spaced angles [0, 2π): plain arrays of equal length. */
export interface PeriodSeries {
  /** Radians. */
  angles: number[];
  /** Volts or amperes at each angle. */
  values: number[];
}

/** The figures of one voltage; a plain serialisable object. */
export interface VoltageFigures {
  /** What the voltage is measured between, e.g. `phase a to star point`. */
  name: string;
  /** Fundamental amplitude, peak volts, and its phase (radians, of sin(θ + phase)). */
  fundamental: number;
  fundamentalPhase: number;
  /** RMS over the period, volts. */
  rms: number;
  /**
   * THD over every order ≥ 2, ratio. Exact from the mean square when `exact`; otherwise (a
   * filtered voltage) the sum to `analysisOrder`, with `thdUpperBound` adding a rigorous bound
   * on the orders above it.
   */
  thd: number;
  thdUpperBound: number;
  /** WTHD over every order ≥ 2, ratio (exact, or the sum to `analysisOrder` as for thd). */
  wthd: number;
  /** True when thd and wthd are exact over the whole waveform (an unfiltered bridge voltage). */
  exact: boolean;
  /** Orders 0..maxOrder, peak volts, labelled by carrier group and sideband (by order alone for a pattern). */
  spectrum: LabelledHarmonic[];
  /** THD of orders 2..maxOrder only, ratio: show it only labelled with that order. */
  spectrumThd: number;
}

/** The figures of one current; a plain serialisable object. */
export interface CurrentFigures {
  /** Which current, e.g. `inverter (switch) current, phase a` (a single-phase bridge's name no phase: `load current`). */
  name: string;
  /** RMS, amperes. */
  rms: number;
  /** Largest |i| over the period, amperes. */
  peak: number;
  /** Fundamental amplitude, peak amperes. */
  fundamental: number;
  /** Its phase, radians, of i₁ = fundamental·sin(θ + fundamentalPhase). */
  fundamentalPhase: number;
  /** RMS of what remains after the fundamental, i − i₁, amperes. */
  rippleRms: number;
  /** rippleRms over the fundamental's RMS, a ratio; null without a fundamental (load/currentDistortion). */
  thd: number | null;
  /** The fundamental's RMS over the RMS, a ratio in [0, 1]. */
  distortionFactor: number;
  /** Peak-to-peak of i − i₁ over the period, amperes. */
  ripplePeakToPeak: number;
  /** The current over one period, for charts. */
  series: PeriodSeries;
}

/** The currents of one phase. */
export interface PhaseCurrents {
  phase: 'a' | 'b' | 'c';
  /** What the bridge leg's switches carry: the filter inductor's current, or the load's without a filter. */
  inverter: CurrentFigures;
  /** Into the filter's shunt branch; null without a filter. */
  capacitor: CurrentFigures | null;
  /** Into the load; null without a load. */
  load: CurrentFigures | null;
}

/**
 * The current the bridge draws from the DC bus, i_dc = Σ s_k·i_k over the legs (s_k = 1 while the
 * upper switch of leg k is on); its AC part is what the DC-link capacitor carries (J. W. Kolar and
 * S. D. Round, IEE Proc. Electric Power Applications, 2006). Sampled on a grid fine enough to
 * hold every switching period (at least 64 samples a carrier period).
 */
export interface DcLinkFigures {
  /** Mean DC current, amperes (the power drawn over vdc). */
  mean: number;
  /** RMS of i_dc, amperes. */
  rms: number;
  /** RMS of the AC part, √(rms² − mean²): the capacitor's ripple current, amperes. */
  rippleRms: number;
  /** Single-phase bridges: amplitude at twice the output frequency, peak amperes; null for three-phase. */
  secondHarmonic: number | null;
  /** Orders 0..maxOrder of i_dc (order 0 the mean), peak amperes. */
  spectrum: LabelledHarmonic[];
  series: PeriodSeries;
  /** Samples per fundamental period the figures were computed from. */
  samplesPerPeriod: number;
}

/**
 * The common-mode voltage of a three-phase bridge: the star point of a balanced load against the
 * DC midpoint, (v_a + v_b + v_c)/3 of the leg voltages (standard circuit analysis). Each step
 * is a dv/dt event that drives bearing and EMI currents (A. M. Hava and E. Ün, IEEE Trans. Power
 * Electronics, 2009).
 */
export interface CommonModeFigures {
  name: string;
  /** One period, volts, exact. */
  waveform: Waveform;
  /** The distinct levels it takes, volts, ascending (±vdc/6, ±vdc/2 for a two-level bridge). */
  levels: number[];
  /** RMS, volts. */
  rms: number;
  /** Steps per fundamental period, and per carrier period (null for a pattern). */
  stepsPerPeriod: number;
  stepsPerCarrierPeriod: number | null;
  /** Orders 0..maxOrder, peak volts, labelled. */
  spectrum: LabelledHarmonic[];
  /**
   * For a reduced common-mode method (`azspwm1`, `nspwm`): the ma range over which it keeps the
   * common mode at ±vdc/6 and the line voltages linear (`reducedCommonModeRange`); null otherwise.
   */
  reducedRange: ReducedCommonModeRange | null;
}

/**
 * How often the legs of a three-phase bridge (or of any multilevel bridge) switch: the cost side
 * of the discontinuous clamps and of the reduced common-mode methods (each edge of a two-level
 * leg voltage is one turn-off and one turn-on in that leg), and what puts a multilevel design
 * and a two-level one side by side at equal device switching frequency.
 */
export interface SwitchingFigures {
  /** Edges of leg a's voltage per fundamental period (every leg has as many by symmetry). */
  legEdgesPerPeriod: number;
  /**
   * Turn-ons of a switch per second, averaged over the period, hertz: for a two-level leg
   * legEdgesPerPeriod/2 times the fundamental frequency (the carrier frequency for continuous
   * PWM); for a multilevel bridge the mean over every device of every leg of its own turn-ons
   * (`MultilevelFigures.averageDeviceFrequency`).
   */
  averageDeviceFrequency: number;
}

/** One leg (string) of a multilevel bridge in the report. */
export interface MultilevelLegFigures {
  /** `leg a`, `leg b`, `leg c`, or `string a`, … for a cascaded bridge. */
  name: string;
  /** The distinct voltages its output takes over the period, volts, ascending. */
  levels: number[];
  /** Edges of its output per fundamental period. */
  edgesPerPeriod: number;
  /** Its output over one period, volts: to the DC midpoint, or to its neutral end (cascaded). */
  waveform: Waveform;
}

/**
 * The balance of what sits inside a multilevel bridge at the design's load, from the report's own
 * inverter currents; the figure of the design's topology is set, the others null.
 */
export interface MultilevelBalanceFigures {
  /** NPC and T-type: the DC midpoint current (mean, RMS, carrier-period averages, ripple), amperes. */
  neutralPoint: NeutralPointCurrentFigures | null;
  /** Flying capacitor: each capacitor's charge per carrier period (coulombs) and RMS current (amperes). */
  flyingCapacitors: FlyingCapacitorCharge | null;
  /** Cascaded H-bridge: each cell source's mean and RMS current (amperes) and power (watts). */
  cellPower: CascadedCellPower | null;
}

/**
 * The multilevel figures of a design (null in a two-level design's report): topology, levels,
 * carriers, each leg's output, leg a's cells, the device switching frequencies, and the balance
 * of the inner capacitors or sources at the design's load.
 */
export interface MultilevelFigures {
  topology: MultilevelTopology;
  topologyLabel: string;
  /** Output levels of one leg (one string for a cascaded bridge). */
  levels: number;
  /** The carrier arrangement; null for space vector. */
  carriers: MultilevelCarrierArrangement | null;
  carriersLabel: string | null;
  /** Every leg (string) of the bridge: two for a single-phase full bridge, one single-phase string, three for three-phase. */
  legs: MultilevelLegFigures[];
  /**
   * Leg a's cells, outermost (cell 1) first, for the level-by-level chart: a cascaded cell's
   * output voltage (volts, −vdc, 0 or +vdc); a flying-capacitor commutation cell's state (its
   * upper switch, 0 or 1). Empty for NPC and T-type legs.
   */
  cells: { name: string; waveform: Waveform }[];
  /** Every device of leg a, top to bottom (cell by cell): turn-ons per period and per second (hertz). */
  devices: DeviceSwitching[];
  /** Mean over every device of every leg of its switching frequency, hertz. */
  averageDeviceFrequency: number;
  /** Highest device switching frequency of the bridge, hertz. */
  maxDeviceFrequency: number;
  /**
   * The rate at which leg a's output steps, hertz: its edges per period over 2 times the
   * fundamental frequency (fc for level-shifted carriers, N·fc for N phase-shifted
   * flying-capacitor cells, 2N·fc for a cascaded string of N phase-shifted cells).
   */
  effectiveOutputFrequency: number;
  /** The balance figures at the design's load; null with neither load nor filter (no current). */
  balance: MultilevelBalanceFigures | null;
  /**
   * With the design's `device` at every position, an NPC or T-type bridge's conduction and
   * switching losses per device, position and class, watts (`threeLevelLosses`, from the report's
   * own currents); null without a device or a current, and for flying-capacitor and cascaded
   * bridges.
   */
  losses: ThreeLevelLosses | null;
  /**
   * A three-level space-vector design's vector diagram; null for every other method.
   */
  vectorDiagram: ThreeLevelVectorDiagramFigures | null;
}

/**
 * The three-level space-vector diagram of a 'multilevel-space-vector' design, for drawing: the
 * 27 states on their 19 points (`threeLevelVectorDiagram`, per unit of vdc) and the sampled
 * reference with the states applied in each switching period
 * (`threeLevelSpaceVectorTrajectory` of the design's modulation: one sample a switching period,
 * two with asymmetric sampling, so its length is bounded by the frequency ratio).
 */
export interface ThreeLevelVectorDiagramFigures {
  diagram: ThreeLevelVectorDiagram;
  trajectory: ThreeLevelTrajectorySample[];
}

/**
 * A grid-connected bridge (the design's `grid`): phase a through the filter (L1, C and its
 * damping) and L2 into a sinusoidal grid behind its impedance, solved per harmonic by
 * superposition (the grid source at the fundamental only, the bridge at every order).
 */
export interface GridFigures {
  /** The grid source, peak volts a phase. */
  phaseVoltage: number;
  /** Grid short-circuit current V_ph/|r + jω₁l|, amperes rms (l2 left out: a conservative ratio). */
  shortCircuitCurrent: number;
  /** I_SC/I_L with I_L the fundamental grid current (the operating point taken as full load). */
  shortCircuitRatio: number;
  /** Current into the grid, phase a: orders 0..maxOrder, peak amperes, labelled. */
  gridCurrentSpectrum: LabelledHarmonic[];
  /** Current out of the bridge leg (through L1), phase a: orders 0..maxOrder, peak amperes, labelled. */
  inverterCurrentSpectrum: LabelledHarmonic[];
  /** Fundamental grid current, peak amperes, and its phase (radians, of sin(θ + phase)). */
  gridCurrentFundamental: number;
  gridCurrentPhase: number;
  /** Harmonic rms of the grid current over its fundamental rms, orders 2..analysisOrder (TDD with I_L the fundamental). */
  gridCurrentThd: number;
  /** Active and reactive power into the grid source, all phases, watts and var (reactive > 0: current lagging the grid voltage). */
  power: number;
  reactivePower: number;
  /** power over apparent power at the fundamental. */
  powerFactor: number;
  /**
   * The LCL resonance (1/2π)·√((L1 + L2')/(L1·L2'·C)) with L2' = l2 + l, hertz, and its distance
   * from the carrier (f_carrier/f_res) and the control bandwidth (f_res/f_bw); whether it sits in
   * Liserre et al.'s 10·f₁…f_carrier/2. Null without a filter or with l2 + l = 0.
   */
  resonance: {
    frequency: number;
    carrierRatio: number | null;
    controlBandwidthRatio: number | null;
    withinLiserreRange: boolean | null;
  } | null;
  /** Power in the damping resistor, all phases, watts (sum to analysisOrder); 0 without one. */
  dampingLoss: number;
  /** The capacitor's fundamental current, amperes rms a phase, and the reactive power it supplies, all phases, var; null without a filter. */
  capacitor: { fundamentalCurrent: number; reactivePower: number } | null;
  /** The grid current against IEEE Std 519-2022 Table 2 and IEEE Std 1547-2018 Tables 26–27 (recalled from memory). */
  limits: { ieee519: GridCurrentLimitCheck; ieee1547: GridCurrentLimitCheck };
  /**
   * Only over a span (`carrierSpan`): the grid current's components at n/q grouped by whole
   * harmonic order before the limits (`harmonicGroups`, IEC 61000-4-7 from memory), groups 1..50,
   * each with the inter- and sub-harmonics assigned to it, and the rule in words.
   */
  harmonicGrouping?: { rule: string; groups: HarmonicGroup[] };
}

/** The losses of the four devices of one leg (upper and lower transistor and diode), W. */
export interface LegLossFigures extends LegLosses {
  /** `leg a`, `leg b`, `leg c` (three-phase: the leg of that phase; single-phase: a feeds the load, b returns it). */
  name: string;
}

/**
 * The semiconductor losses of a two-level bridge with the design's `device`, from the report's own
 * phase currents and the exact leg waveforms (conduction per device over the period, switching
 * at each edge with the current there; the model of losses/, switching energies scaled linearly
 * with voltage and current, common practice). Switching loss is proportional to the number of
 * edges, so to the carrier frequency for a given waveform shape.
 */
export interface DesignLossFigures {
  deviceKind: SemiconductorDevice['kind'];
  /** Each leg's devices, W (a MOSFET's diode has recovery loss only). */
  legs: LegLossFigures[];
  /** All devices, W. */
  conduction: number;
  switching: number;
  total: number;
  /** Power the bridge delivers to its output, W: vdc × the DC-link current's mean (load, back-EMF or grid, filter damping). */
  outputPower: number;
  /** outputPower / (outputPower + total), a ratio; null when no power flows out (outputPower ≤ 0). */
  efficiency: number | null;
}

/** Everything the product shows about one design, from {@link analyseDesign}; plain data. */
export interface DesignReport {
  method: ModulationMethod;
  methodLabel: string;
  /** 1 (single-phase bridge) or 3 (three-phase bridge, star-connected load and filter). */
  phaseCount: 1 | 3;
  /** carrierFrequency/fundamentalFrequency; null for a stored pattern. */
  frequencyRatio: number | null;
  fundamentalFrequency: number;
  /** Highest order of every `spectrum`. */
  maxOrder: number;
  /** Highest order summed for the filtered figures (their tails are bounded beyond it). */
  analysisOrder: number;
  /** The bridge's output voltages, named (phases to the load, and legs and lines for three-phase). */
  voltages: NamedVoltage[];
  /** Reference and carrier the modulator compares, for the modulator chart; null for a stored pattern. */
  modulator: ModulatorSignals | null;
  /** The bridge voltage across phase a of the load side (before any filter). */
  bridge: VoltageFigures;
  /** Line-to-line a−b of the bridge (three-phase only). */
  lineToLine: VoltageFigures | null;
  /** The filter's output voltage of phase a, loaded by the load; null without a filter. */
  output: (VoltageFigures & { series: PeriodSeries }) | null;
  /** Currents of each phase; empty with neither load nor filter. */
  currents: PhaseCurrents[];
  /**
   * The current drawn from the DC bus; null with neither load nor filter, for a staircase (one
   * source a cell), and for an NPC, T-type or cascaded bridge, whose DC side carries more than one
   * current (the rails and the midpoint of a three-level link, a source per cascaded cell), so no
   * one i_dc describes it: `multilevel.balance` holds their figures. A flying-capacitor bridge
   * has one DC link, and i_dc = Σ s₁·i of its outermost cells (`multilevelDcLinkSwitching`).
   */
  dcLink: DcLinkFigures | null;
  /** The common-mode voltage (three-phase only). */
  commonMode: CommonModeFigures | null;
  /**
   * How often the legs switch: every two-level bridge (a single-phase bridge's leg a, read from its
   * output) and every multilevel bridge; null for a staircase pattern.
   */
  switching: SwitchingFigures | null;
  /** The multilevel figures; null for a two-level bridge or a staircase pattern. */
  multilevel: MultilevelFigures | null;
  /** Mean power into the load resistance, all phases together, watts; null without a load. */
  loadPower: number | null;
  /**
   * Semiconductor losses by device with the design's `device`; null without a device, with
   * neither load nor filter (no current), or for a bridge that is not two-level (a staircase).
   */
  losses: DesignLossFigures | null;
  /** What a load with back-EMF converts (torque-producing current per phase, air-gap power); null without an EMF. */
  motor: MotorFigures | null;
  /**
   * The LC filter's own figures (unloaded) and its loaded gain; null without a filter. With a
   * grid these are L1 with C only (without L2 and the grid): the resonance a grid design has is
   * the LCL's, `grid.resonance` (read both through `designResonance`).
   */
  filter: {
    characteristics: LcFilterCharacteristics;
    /** |V_out/V_bridge| at the fundamental and at the carrier frequency, with the load. */
    gainAtFundamental: number;
    gainAtCarrier: number | null;
  } | null;
  /** The limit check of the voltage at the point of coupling (the filter's output where there is one). */
  limitCheck: HarmonicLimitCheck;
  /** The grid-connected figures; null without a `grid`. */
  grid: GridFigures | null;
  /** Cautions the product shows with these figures. */
  cautions: string[];
  /**
   * Present only when the carrier is not a whole multiple of the fundamental (sine-triangle,
   * three-phase carrier, space vector): the ratio analysed and its span. Then every waveform and
   * series covers the span of q fundamental periods mapped onto [0, 2π) (the modulator chart
   * the first fundamental period), the spectra hold orders n/q (sub- and inter-harmonics, each
   * with its `kind`), and every figure is over the span; see {@link CarrierSpanFigures}.
   */
  carrierSpan?: CarrierSpanFigures;
}

/**
 * The frequency ratio of a design whose carrier is not a whole multiple of the fundamental: the
 * nearest p/q with q ≤ 64 (`designRationalRatio`), whose pattern repeats after q fundamental
 * periods (p carrier cycles), the span every figure of the report is computed over.
 */
export interface CarrierSpanFigures {
  /** Carrier cycles in the span. */
  p: number;
  /** Fundamental periods in the span, 1 to 64. */
  q: number;
  /** Hertz, p/q·fundamentalFrequency: the carrier analysed. */
  carrierFrequency: number;
  /** The carrier analysed minus the one asked for, hertz (0 to rounding for an exact p/q). */
  carrierError: number;
  /** Hertz, fundamentalFrequency/q: the spacing of the spectra's components. */
  baseFrequency: number;
}
