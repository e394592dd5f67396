import { TAU } from '../math.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { lclResonanceFrequency } from './lclResonanceFrequency.js';

/** The rated operating point and targets of {@link designLclFilter}. */
export interface LclDesignOptions {
  /** Rated active power, all three phases, watts, in [1, 1e9]. */
  power: number;
  /** Grid voltage, volts rms line to line, in [1, 1e6]. */
  lineVoltage: number;
  /** Grid frequency, hertz, in [1, 1e4]. */
  gridFrequency: number;
  /** Switching (carrier) frequency, hertz, above 10× the grid frequency, ≤ 1e8. */
  switchingFrequency: number;
  /** DC bus, volts, in [1, 1e6]. */
  vdc: number;
  /** Largest peak-to-peak inverter current ripple over the rated peak current, in [0.001, 1]. @default 0.1 */
  rippleRatio?: number;
  /** Capacitance over the base capacitance, in [0.0001, 1]. @default 0.05 */
  capacitorRatio?: number;
  /** Grid-side over inverter-side ripple current at the switching frequency, in [0.001, 1). @default 0.2 */
  attenuation?: number;
}

/** The outcome of {@link designLclFilter}: the filter, its figures and the constraints it met. */
export interface LclDesign {
  /** Inverter-side inductance, henries. */
  l1: number;
  /** Capacitance (star-connected, per phase), farads. */
  c: number;
  /** Grid-side inductance, henries (the grid's own inductance adds to it). */
  l2: number;
  /** Damping resistor in series with the capacitor, ohms. */
  rDamping: number;
  /** Base impedance E²/P, ohms, and base capacitance 1/(ω_g·Z_b), farads. */
  baseImpedance: number;
  baseCapacitance: number;
  /** Rated current, peak amperes a phase, √2·P/(√3·E). */
  ratedCurrent: number;
  /** The ripple bound vdc/(4·L1·f_sw) the design meets, peak-to-peak amperes. */
  rippleBound: number;
  /** Undamped LCL resonance with a stiff grid, hertz. */
  resonanceFrequency: number;
  /** The range Liserre et al. ask of the resonance, [10·f_g, f_sw/2], hertz. */
  resonanceRange: { min: number; max: number };
  withinResonanceRange: boolean;
  /** (L1 + L2)·ω_g/Z_b: the series voltage drop at rated current, per unit (Liserre et al. keep it below 0.1). */
  totalInductancePerUnit: number;
  /** What the design could not meet, in words; empty when every constraint holds. */
  notes: string[];
}

/**
 * Sizes an LCL filter for a three-phase grid-connected two-level bridge by the steps of
 * M. Liserre, F. Blaabjerg and S. Hansen, "Design and control of an LCL-filter-based
 * three-phase active rectifier", IEEE Trans. Industry Applications, 2005 (the targets are
 * recalled from memory: confirm with the paper):
 *
 * 1. Base values Z_b = E²/P and C_b = 1/(ω_g·Z_b), E the rms line voltage.
 * 2. C = capacitorRatio·C_b (the paper keeps the capacitor's reactive power below 5 % of P).
 * 3. L1 from the ripple target: a two-level leg switching ±vdc/2 about its mean at duty ½
 *    ripples by at most Δi = vdc/(4·L1·f_sw) peak to peak (volt-seconds over a carrier period,
 *    derived here; a star-connected three-phase load sees less), so
 *    L1 = vdc/(4·f_sw·rippleRatio·Î), Î the rated peak current.
 * 4. L2 from the attenuation of the ripple from the inverter to the grid at f_sw with a stiff
 *    grid and no damping, |i_g/i_1| = 1/(ω²L2C − 1): L2 = (1 + 1/attenuation)/(C·ω_sw²).
 * 5. The resonance (L1 + L2)/(L1·L2·C) checked against 10·f_g ≤ f_res ≤ f_sw/2.
 * 6. R_d = 1/(3·ω_res·C), a third of the capacitor's impedance at the resonance.
 *
 * @throws ParameterRangeError naming the option and its range
 */
export function designLclFilter(options: LclDesignOptions): LclDesign {
  const { power, lineVoltage, gridFrequency, switchingFrequency, vdc } = options;
  const { rippleRatio = 0.1, capacitorRatio = 0.05, attenuation = 0.2 } = options;
  // Bounds that keep every figure a finite, non-zero double (their extremes worked through).
  assertNumberInRange('power', power, { min: 1, max: 1e9 });
  assertNumberInRange('lineVoltage', lineVoltage, { min: 1, max: 1e6 });
  assertNumberInRange('gridFrequency', gridFrequency, { min: 1, max: 1e4 });
  assertNumberInRange('switchingFrequency', switchingFrequency, {
    min: 10 * gridFrequency,
    minExclusive: true,
    max: 1e8,
  });
  assertNumberInRange('vdc', vdc, { min: 1, max: 1e6 });
  assertNumberInRange('rippleRatio', rippleRatio, { min: 1e-3, max: 1 });
  assertNumberInRange('capacitorRatio', capacitorRatio, { min: 1e-4, max: 1 });
  assertNumberInRange('attenuation', attenuation, { min: 1e-3, max: 1, maxExclusive: true });
  const gridOmega = TAU * gridFrequency;
  const switchingOmega = TAU * switchingFrequency;
  const baseImpedance = (lineVoltage * lineVoltage) / power;
  const baseCapacitance = 1 / (gridOmega * baseImpedance);
  const ratedCurrent = (Math.SQRT2 * power) / (Math.sqrt(3) * lineVoltage);
  const c = capacitorRatio * baseCapacitance;
  const l1 = vdc / (4 * switchingFrequency * rippleRatio * ratedCurrent);
  const l2 = (1 + 1 / attenuation) / (c * switchingOmega * switchingOmega);
  const resonanceFrequency = lclResonanceFrequency(l1, l2, c);
  const rDamping = 1 / (3 * TAU * resonanceFrequency * c);
  const resonanceRange = { min: 10 * gridFrequency, max: switchingFrequency / 2 };
  const withinResonanceRange =
    resonanceFrequency >= resonanceRange.min && resonanceFrequency <= resonanceRange.max;
  const totalInductancePerUnit = ((l1 + l2) * gridOmega) / baseImpedance;
  const notes: string[] = [];
  if (!withinResonanceRange)
    notes.push(
      `The resonance ${resonanceFrequency.toFixed(0)} Hz is outside ${resonanceRange.min.toFixed(0)}–${resonanceRange.max.toFixed(0)} Hz ` +
        '(10× the grid frequency to half the switching frequency): change the capacitor ratio, the ripple or the attenuation.',
    );
  if (totalInductancePerUnit > 0.1)
    notes.push(
      `L1 + L2 is ${totalInductancePerUnit.toFixed(3)} per unit, above 0.1: the voltage drop at rated current asks for a higher DC bus.`,
    );
  return {
    l1,
    c,
    l2,
    rDamping,
    baseImpedance,
    baseCapacitance,
    ratedCurrent,
    rippleBound: vdc / (4 * l1 * switchingFrequency),
    resonanceFrequency,
    resonanceRange,
    withinResonanceRange,
    totalInductancePerUnit,
    notes,
  };
}
