/**
 * Landmarks of the space-vector modulation index m = √3·|Vref|/vdc (|Vref| peak phase volts).
 */

/** End of the linear range: the circle inscribed in the hexagon, |Vref| = vdc/√3 (Holmes and
 * Lipo 2003, ch. 5; van der Broeck et al. 1988). */
export const LINEAR_LIMIT_M = 1;

/** The hexagon's vertex, |Vref| = 2·vdc/3 (an active vector's length): the largest m a single
 * switching period can realise, reached only at the vertex angles. */
export const HEXAGON_VERTEX_M = 2 / Math.sqrt(3);

/**
 * Fundamental, in m units, of a reference that runs round the hexagon at uniform angular speed:
 * (1/π)·∫ sec over a sector = (3/π)·ln 3 ≈ 1.0490 (standard integral ∫sec = ln|sec + tan|).
 * The end of Holtz's overmodulation mode I and the bound of the uncompensated hexagon limit
 * (about 0.9514 of six-step).
 */
export const HEXAGON_TRAJECTORY_M = (3 / Math.PI) * Math.log(3);

/**
 * Six-step operation: the phase fundamental is (2/π)·vdc (Fourier series of the ±vdc/2 square
 * leg voltage, 4·(vdc/2)/π), so m = √3·(2/π) = 2√3/π ≈ 1.1027.
 */
export const SIX_STEP_M = (2 * Math.sqrt(3)) / Math.PI;
