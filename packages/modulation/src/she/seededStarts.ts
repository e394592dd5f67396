/**
 * Deterministic starting guesses for the SHE and optimal-pattern solvers (internal): first the
 * evenly spread angles α_k = k·π/(2(N+1)), then sorted uniform random angles from a seeded
 * {@link mulberry32} generator, all strictly ascending in (0, π/2) with gaps of at least 1 % of
 * the even spacing. No module state: each call owns its generator, so the same seed gives the
 * same starts.
 */
import { HALF_PI } from '../math.js';
import { mulberry32 } from '../numeric/mulberry32.js';

/** `howMany` starting angle sets of `count` angles each. */
export function seededStarts(count: number, howMany: number, seed: number): number[][] {
  const spacing = HALF_PI / (count + 1);
  const starts: number[][] = [];
  if (howMany > 0) starts.push(Array.from({ length: count }, (_, k) => (k + 1) * spacing));
  const random = mulberry32(seed);
  while (starts.length < howMany) {
    const angles = Array.from({ length: count }, () => random() * HALF_PI).sort((a, b) => a - b);
    let ok =
      (angles[0] as number) > 0.01 * spacing &&
      HALF_PI - (angles[count - 1] as number) > 0.01 * spacing;
    for (let k = 1; k < count && ok; k++)
      ok = (angles[k] as number) - (angles[k - 1] as number) > 0.01 * spacing;
    if (ok) starts.push(angles);
  }
  return starts;
}
