/**
 * The double Fourier series of naturally sampled multicarrier PWM, computed numerically and
 * independently of the library (H. S. Black, *Modulation Theory*, 1953; D. G. Holmes and
 * T. A. Lipo, *Pulse Width Modulation for Power Converters*, 2003, ch. 3 and ch. 11;
 * B. P. McGrath and D. G. Holmes, "Multicarrier PWM strategies for multilevel inverters", IEEE
 * Trans. Industrial Electronics, 2002).
 *
 * A multilevel leg is a constant plus a weighted sum of comparators, each 1 while its reference
 * r(y) (a function of the fundamental angle y, normalised to its own unit triangle) is above a
 * unit triangle of carrier angle x, 0 below. With the triangle's valley at x = 0 the comparator
 * is 1 on |x| < a(y) = π(1 + clip(r(y), −1, 1))/2 (mod 2π): a closed form in x for every y. So
 * the coefficient
 *
 *   C_mn = 1/(4π²) ∫∫ F(x, y) e^{−j(mx + ny)} dx dy
 *
 * takes its inner integral analytically (2·sin(m·a)/m, or 2a for m = 0) and its outer one by
 * composite Gauss–Legendre quadrature, split where r(y) reaches ±1 (a kink of a(y)) and at the
 * reference's own kinks. In the time domain x = mf·(θ − π/2) − φ, φ the comparator's carrier
 * delay (the library's alignment: a valley of the undelayed carrier at θ = π/2), and y = θ, so
 * the component of order h collects C_{m, h − m·mf}·e^{−jm(mf·π/2 + φ)} over m.
 */

/** One comparator of a leg, weighted in volts per unit of its 0/1 state. */
export interface Comparator {
  /** The reference against the unit triangle, a function of the fundamental angle (radians). */
  reference: (y: number) => number;
  /** Angles in [0, 2π) where the reference has a kink (a zero sequence's change of form). */
  kinks: readonly number[];
  /** The carrier's delay in carrier radians (carrierPhase plus the comparator's own). */
  delay: number;
  /** Volts the comparator adds while it is 1. */
  weight: number;
}

/** A voltage as `offset` plus the weighted comparators. */
export interface ComparatorSum {
  offset: number;
  comparators: readonly Comparator[];
}

/** Complex number as a pair. */
export interface Phasor {
  re: number;
  im: number;
}

const GAUSS_POINTS = 16;
const SUBINTERVALS = 512; // per period: each 12 mrad wide, 16 nodes resolve e^{jny} for |n| ≤ 600
const SEARCH_GRID = 8192; // per period, for the angles where r(y) reaches ±1

/** Nodes and weights of Gauss–Legendre quadrature on [−1, 1] (Newton on P_n, from memory). */
function gaussLegendre(count: number): { nodes: number[]; weights: number[] } {
  const nodes: number[] = [];
  const weights: number[] = [];
  for (let i = 1; i <= count; i++) {
    let x = Math.cos((Math.PI * (i - 0.25)) / (count + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= count; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      derivative = (count * (x * p1 - p0)) / (x * x - 1);
      const step = p1 / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    nodes.push(x);
    weights.push(2 / ((1 - x * x) * derivative * derivative));
  }
  return { nodes, weights };
}

const RULE = gaussLegendre(GAUSS_POINTS);

/** Angles in (0, 2π) where f changes sign, by a grid scan and bisection. */
function signChanges(f: (y: number) => number): number[] {
  const found: number[] = [];
  const step = (2 * Math.PI) / SEARCH_GRID;
  for (let i = 0; i < SEARCH_GRID; i++) {
    let a = i * step;
    let b = a + step;
    let fa = f(a);
    const fb = f(b);
    if (fa === 0 || fa > 0 === fb > 0) continue;
    for (let k = 0; k < 80; k++) {
      const mid = (a + b) / 2;
      const fm = f(mid);
      if (fm > 0 === fa > 0) {
        a = mid;
        fa = fm;
      } else b = mid;
    }
    found.push((a + b) / 2);
  }
  return found;
}

/** Quadrature nodes over [0, 2π) for one comparator: its y, weight and half-width a(y). */
interface ComparatorNodes {
  y: Float64Array;
  w: Float64Array;
  a: Float64Array;
}

function comparatorNodes(comparator: Comparator): ComparatorNodes {
  const { reference, kinks } = comparator;
  const splits = [
    0,
    2 * Math.PI,
    ...kinks,
    ...signChanges((y) => reference(y) - 1),
    ...signChanges((y) => reference(y) + 1),
  ].sort((p, q) => p - q);
  const y: number[] = [];
  const w: number[] = [];
  for (let s = 0; s + 1 < splits.length; s++) {
    const start = splits[s] as number;
    const end = splits[s + 1] as number;
    if (!(end > start)) continue;
    const pieces = Math.max(1, Math.ceil(((end - start) / (2 * Math.PI)) * SUBINTERVALS));
    const width = (end - start) / pieces;
    for (let p = 0; p < pieces; p++) {
      const centre = start + (p + 0.5) * width;
      RULE.nodes.forEach((node, k) => {
        y.push(centre + (node * width) / 2);
        w.push(((RULE.weights[k] as number) * width) / 2);
      });
    }
  }
  const a = y.map((angle) => {
    const r = Math.min(1, Math.max(-1, reference(angle)));
    return (Math.PI * (1 + r)) / 2;
  });
  return { y: Float64Array.from(y), w: Float64Array.from(w), a: Float64Array.from(a) };
}

/**
 * The complex Fourier coefficients V_h (v(θ) = Σ V_h e^{jhθ}) of a comparator sum for orders
 * 0…maxOrder, from the double Fourier terms with carrier index m in [mMin, mMax]. The one-sided
 * amplitude of order h ≥ 1 is 2|V_h|, and v_h(θ) = 2·Re V_h·cos hθ − 2·Im V_h·sin hθ.
 */
export function doubleFourierPhasors(
  sum: ComparatorSum,
  mf: number,
  maxOrder: number,
  mMin: number,
  mMax: number,
): Phasor[] {
  const result: Phasor[] = Array.from({ length: maxOrder + 1 }, () => ({ re: 0, im: 0 }));
  for (const group of doubleFourierGroups(sum, mf, maxOrder, mMin, mMax).values()) {
    group.forEach((p, h) => {
      const target = result[h] as Phasor;
      target.re += p.re;
      target.im += p.im;
    });
  }
  return result;
}

/**
 * The contribution of each carrier group m in [mMin, mMax] (m = 0: the baseband, with the sum's
 * offset) to V_h, h = 0…maxOrder: the term C_{m, h − m·mf}·e^{−jm(mf·π/2 + φ)} summed over the
 * comparators.
 */
export function doubleFourierGroups(
  sum: ComparatorSum,
  mf: number,
  maxOrder: number,
  mMin: number,
  mMax: number,
): Map<number, Phasor[]> {
  const groups = new Map<number, Phasor[]>();
  for (let m = mMin; m <= mMax; m++) {
    groups.set(
      m,
      Array.from({ length: maxOrder + 1 }, (_, h) => ({
        re: m === 0 && h === 0 ? sum.offset : 0,
        im: 0,
      })),
    );
  }
  for (const comparator of sum.comparators) {
    const nodes = comparatorNodes(comparator);
    const count = nodes.y.length;
    // e^{−jy} at each node: each next order multiplies the running e^{−jny} by it.
    const stepRe = nodes.y.map((y) => Math.cos(y));
    const stepIm = nodes.y.map((y) => -Math.sin(y));
    const scale = comparator.weight / (4 * Math.PI * Math.PI);
    for (let m = mMin; m <= mMax; m++) {
      const group = groups.get(m) as Phasor[];
      // Inner integral over x in closed form, ∫_{−a}^{a} e^{−jmx} dx, times the node's weight.
      const weighted = new Float64Array(count);
      for (let i = 0; i < count; i++) {
        const a = nodes.a[i] as number;
        weighted[i] = (nodes.w[i] as number) * (m === 0 ? 2 * a : (2 * Math.sin(m * a)) / m);
      }
      // e^{−jm(mf·π/2 + φ)} moves the term from (x, y) to θ.
      const shift = -m * ((mf * Math.PI) / 2 + comparator.delay);
      const firstN = -m * mf;
      const zRe = nodes.y.map((y) => Math.cos(-firstN * y));
      const zIm = nodes.y.map((y) => Math.sin(-firstN * y));
      for (let h = 0; h <= maxOrder; h++) {
        let re = 0;
        let im = 0;
        for (let i = 0; i < count; i++) {
          const c = weighted[i] as number;
          const zr = zRe[i] as number;
          const zi = zIm[i] as number;
          re += c * zr;
          im += c * zi;
          const sr = stepRe[i] as number;
          const si = stepIm[i] as number;
          zRe[i] = zr * sr - zi * si;
          zIm[i] = zr * si + zi * sr;
        }
        const target = group[h] as Phasor;
        target.re += scale * (re * Math.cos(shift) - im * Math.sin(shift));
        target.im += scale * (re * Math.sin(shift) + im * Math.cos(shift));
      }
    }
  }
  return groups;
}
