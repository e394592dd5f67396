import FFT from 'fft.js';
import { periodSynthesiser, type PeriodSynthesiser } from './periodSynthesiser.js';
import { spectrumLabeller, type SpectrumLabeller } from './spectrumLabeller.js';

/**
 * Transform plans a caller keeps between design reports (`AnalyseDesignOptions.plans`): the
 * `fft.js` transforms of the reports' sample grids, whose tables cost about as much to build as a
 * transform (0.65 ms of a three-phase filtered report at mf 101 on a 16384-sample grid), the
 * synthesiser of filtered time series built on each, and the label table of the last spectrum
 * orders and carrier ratio (0.2 ms and 0.5 MB of strings a report to 5000 orders, built again only
 * when a report labels other orders or another ratio). Not shared between threads: a worker keeps
 * its own. The plans hold the last six grid sizes asked for (see {@link PLAN_SIZES}), so a
 * run of reports at one or two designs' grids builds nothing again, and memory stays bounded (a
 * grid of S samples holds about 7·S doubles: 3.7 MB at S = 65536, 29 MB at the largest, 2^19).
 */
export interface DesignReportPlans {
  /** The transform of size S (a power of two ≥ 4), built on first use. */
  transform(size: number): FFT;
  /** The synthesiser of size S on that transform, built on first use. */
  synthesiser(size: number): PeriodSynthesiser;
  /**
   * The labeller of orders 0..maxOrder by carrier group of `ratio` (`spectrumLabeller`), kept for
   * the last maxOrder and ratio asked for: its table is read, never changed, by the reports.
   */
  labeller(maxOrder: number, ratio: number): SpectrumLabeller;
}

/**
 * How many grid sizes {@link designReportPlans} keeps (the least recently used goes first): a
 * filtered report reads four, its currents' grid S and its output chart's (`outputSeriesSize`,
 * 4096 at the default points for mf up to 200) and the half of each (the half-wave synthesis
 * and the DC link's half period), so reports alternating between two designs (six sizes when
 * their current grids differ) build nothing again.
 */
const PLAN_SIZES = 6;

/**
 * New, empty transform plans for `analyseDesign` (see {@link DesignReportPlans}). The figures
 * are the same with or without them, bit for bit: the same transforms, built once instead of once a
 * report. Reports run one at a time on a thread, so one set serves every call on it.
 */
export function designReportPlans(): DesignReportPlans {
  const kept = new Map<number, { fft: FFT; synthesiser: PeriodSynthesiser | null }>();
  const entry = (size: number): { fft: FFT; synthesiser: PeriodSynthesiser | null } => {
    let found = kept.get(size);
    if (found === undefined) {
      found = { fft: new FFT(size), synthesiser: null };
      if (kept.size >= PLAN_SIZES) kept.delete(kept.keys().next().value as number);
    } else kept.delete(size);
    // Re-inserted last: the Map's order is the order of use.
    kept.set(size, found);
    return found;
  };
  let labels: { maxOrder: number; ratio: number; labeller: SpectrumLabeller } | null = null;
  return {
    transform: (size) => entry(size).fft,
    synthesiser: (size) => {
      const found = entry(size);
      found.synthesiser ??= periodSynthesiser(size, found.fft, (half) => entry(half).fft);
      return found.synthesiser;
    },
    labeller: (maxOrder, ratio) => {
      if (labels === null || labels.maxOrder !== maxOrder || labels.ratio !== ratio)
        labels = { maxOrder, ratio, labeller: spectrumLabeller(maxOrder, ratio) };
      return labels.labeller;
    },
  };
}
