import type { RationalRatio } from './designRationalRatio.js';

/**
 * The order (in fundamentals) a filtered design's report at a ratio p/q must solve its network
 * to at least: ⌈10·p/q⌉ + 10, the one-period report's 10·mf + 10 (past the tenth carrier group,
 * beyond which the switching tail stands for the rest). Internal: designSpanMaxOrder and
 * analyseDesignSpan.
 */
export function spanFilterOrder(span: Pick<RationalRatio, 'p' | 'q'>): number {
  return Math.ceil((10 * span.p) / span.q) + 10;
}
