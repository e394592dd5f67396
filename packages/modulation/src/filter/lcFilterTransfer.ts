import type { LcFilterOptions } from './LcFilterOptions.js';

/** A complex number as a plain pair. */
export interface Complex {
  re: number;
  im: number;
}

/**
 * H(jω) = V_out/V_in of a validated {@link LcFilterOptions} at `omega` (rad/s ≥ 0), from series
 * impedance Z_s and shunt admittance Y_sh: H = 1/(1 + Z_s·Y_sh) (voltage divider, standard
 * circuit analysis). Internal: shared by the filter functions.
 */
export function lcFilterTransfer(filter: LcFilterOptions, omega: number): Complex {
  const { l, c, rDamping = 0, dampingPlacement = 'series-with-capacitor', cDamping = 0, loadR } = filter;
  let series: Complex = { re: 0, im: omega * l };
  let shunt: Complex;
  if (dampingPlacement === 'series-with-capacitor') {
    shunt = divide({ re: 0, im: omega * c }, { re: 1, im: omega * rDamping * c });
  } else if (dampingPlacement === 'parallel-rc') {
    const branch = divide({ re: 0, im: omega * cDamping }, { re: 1, im: omega * rDamping * cDamping });
    shunt = { re: branch.re, im: branch.im + omega * c };
  } else {
    series = divide({ re: 0, im: omega * l * rDamping }, { re: rDamping, im: omega * l });
    shunt = { re: 0, im: omega * c };
  }
  if (loadR !== undefined) shunt = { re: shunt.re + 1 / loadR, im: shunt.im };
  const product = multiply(series, shunt);
  return divide({ re: 1, im: 0 }, { re: 1 + product.re, im: product.im });
}

function multiply(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

function divide(a: Complex, b: Complex): Complex {
  const scale = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / scale, im: (a.im * b.re - a.re * b.im) / scale };
}
