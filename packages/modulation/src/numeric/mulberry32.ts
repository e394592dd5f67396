/**
 * A seeded pseudo-random generator: mulberry32 (a small public-domain 32-bit generator by
 * T. Ettinger, 2017; from memory). Returns a function giving numbers uniform in [0, 1), 2⁻³² apart;
 * the same `seed` (taken modulo 2³²) gives the same sequence. For repeatable starting guesses and
 * invented demo data, never for anything secret. No module state: each call owns its generator.
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
