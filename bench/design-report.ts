/**
 * Benchmark (not a test): the full design report of a three-phase design at mf 101 (load, LC
 * filter, DC-link current, common-mode voltage, semiconductor losses) against the exact spectrum
 * of its phase voltage alone to 50·mf, measured in one run; issue 12 asks for the report under
 * 5 ms. Also the report without a filter (the exact piecewise-exponential currents) and without
 * losses, for the cost of each part. Times are CPU times of this process (`medianCpuTime`): the
 * machine is shared, and wall times there bounce 2–5× with the other processes' load.
 *
 * Issue 12 speed work, second round (this bench, three runs of the code before and after taken
 * in turn on the busy 2-core machine, median CPU ms; every figure of a 40-design corpus of all
 * methods, zero sequences, filters, grids and devices equal to rounding): spectrum alone 1.1;
 * no filter, spectra to 5000: 15–16 → 9–10; LC filter, to 5000: 27–32 → 10–13; LC filter,
 * default order: 13–15 → 8–8.5; full report (filter, losses), to 5000: 30–32 → 10.5–12 (27.8× →
 * 9.5–10.3× the spectrum alone); full, default order: 15–17 → 8.7–9.9. What changed: the three
 * legs' exact spectra are read once and the phase, line and common-mode spectra are their
 * linear combinations (before: phase a twice, phases b and c, line a−b and the common mode each
 * from its own waveform, about 3.5 times the edges × orders); one label table for every
 * spectrum, labelled straight from the phasors; the filter network solved once per order for the
 * three phases, without an object per complex number; typed arrays through the filtered phases,
 * the DC link and the losses; no array iterator or boxed number per sample or order (12 → 7.6 MB
 * of heap a report); the unfiltered currents' sines read once for the three phases; waveforms
 * combined by merging their edges; the filter's peak scan solves each frequency once; the grid
 * figures read the shared phasors (a grid design at mf 101 to 5000: 17–22 → 9.5–11.5 ms).
 *
 * The 5 ms goal is not reached. Where the full report's time goes, each part timed alone with the
 * report's own inputs on a quieter moment (median CPU ms; the whole report took 7.9 there): the
 * leg waveforms, phases and lines 0.9 (three-phase/threePhase 0.5 of it); the three legs' exact
 * spectra to 5000 and their combinations 1.4 (one phase voltage's spectrum alone is 1.0: a leg has
 * a third of its edges); the filtered phases a, b and c 2.3, of which the four synthesis
 * transforms of the 16384-sample grid take 1.0 (the grid is 16 samples a cycle of the current
 * order 10·mf + 10) and the per-sample figures, switching tails and output labels the rest;
 * building that transform's tables (fft.js, once a report) 0.65; the DC link 0.4; the label table
 * 0.34 and the bridge and line figures 0.35; losses 0.3; common mode 0.26; limit check and
 * modulator 0.26; the network's response to each order 0.11: 7.2 of work, and garbage
 * collection of what a report holds (five labelled spectra of 5001 orders are 2–3 MB of small
 * objects) the rest.
 *
 * Third round: the fft.js tables are kept by the caller (`designReportPlans`, passed as
 * `AnalyseDesignOptions.plans`; the API's compute workers keep one set a thread), measured in the
 * last row: full report to 5000, 9.4 → 8.6 ms CPU in one run (the same figures, bit for bit). The
 * compute workers get a 96 MB young generation (`resourceLimits.maxYoungGenerationSizeMb`; V8's
 * default 48): in worker threads, 2.1–2.5 → 1.4–1.7 scavenges a full report and a third less
 * garbage-collection time (`npm start`'s `--max-semi-space-size=64` reaches the workers too and
 * gives the same). A CPU profile of 300 full reports with plans after that: garbage collection
 * 16 %, labelling the five spectra's phasors (a square root, an arc tangent and an object an
 * order) 10 %, the legs' exact sums 8 % (+3 %), the four synthesis transforms 7 %, the filtered
 * phases' per-sample figures, tails and sums 13 %, combineWaveforms 3 %, the DC link 3 % + 1.5 %
 * (its real transform). The 5 ms goal is still not reached at spectra to 5000 (the default order,
 * 5.4–5.7 ms, is near it); what is left is spread thin, the largest single part being the labelled
 * objects of the report's own answer.
 *
 * Third round, second part (each step's figures bit-identical on the 40-design corpus, with and
 * without plans; measured as 500–600 full reports with plans alternating between the builds
 * before and after in one process, so both see the same load): a filtered phase's per-sample
 * figures in one pass (the switching tail added, the inverter, load and capacitor currents' peaks
 * and ripple extremes together; the capacitor's chart series read as inverter minus load at its
 * picked samples, no capacitor array): lower quartile 7.73–7.85 → 7.37–7.49 ms; the plans keep
 * the label table of the last orders and ratio (0.22 ms and 0.5 MB a report): → 7.08–7.11 ms;
 * the legs' exact sums read their edges from typed arrays into locals (one leg to 5000:
 * 0.33–0.36 → 0.25–0.29 ms; eight edges side by side measured slower, 0.67 ms, and left out).
 * All three against the round's first part: full report to 5000, lower quartile 7.03–7.65 →
 * 5.77–6.88 ms CPU, median 8.44–9.68 → 7.02–8.45 ms; at the default order 4.28 → 3.81 ms
 * (median 4.55 → 4.06, under the 5 ms goal); 77 → 60 scavenges in 120 reports. CPU profile of
 * 300 full reports with plans after them: the legs' exact sums 10 % (+2 %), the four synthesis
 * transforms 9 % (+2 % the DC link's real transform), garbage collection 9 %, labelling 9 %,
 * combineWaveforms 3.5 %, the DC link 3.5 %, the filtered phases' per-sample figures and tails
 * 7 %. Tried and left out: the labelling loop written as one object literal without the table
 * check (no difference: V8 inlines it), the DC link's angle by multiplication (no difference).
 * The 5 ms goal is not reached at spectra to 5000: what remains is the exact sums (E·N), the
 * transforms and the report's own labelled objects.
 *
 * Fourth round (each step bit-identical on the 40-design corpus, with and without plans, except
 * the second, which moves figures by rounding only: 1e-14 of each figure's scale): the DC link's
 * sampled current and the switching tail's running integral walk their waveforms' segments
 * (firstGridSampleFrom) instead of testing an edge at each of 16384 samples; phase c's sampled
 * currents of a filtered three-phase report are minus a's and b's (Kirchhoff at the star point),
 * one synthesis transform and one tail sampling fewer; the carrier comparison builds its search
 * grid and candidate edges in order instead of sorting them each half period (threePhase at mf
 * 101: 454 → 358 µs); the line voltages are threePhase's own, not combined a second time
 * (modulationVoltages 503 → 400 µs); the common-mode levels are rounded once each, not at every
 * edge (2 % of a report); the synthesiser clears only what its last call wrote; the switching
 * tail is worked out in the extremes pass, not in a pass of its own (alone: 61 → 23 µs a phase,
 * within the noise of the whole report); networkPhasors
 * builds its result before its loop (V8 compiled that loop by on-stack replacement before the
 * code after it had type feedback and then deoptimised it at every later call, 12 times a
 * report, in 6 of 10 processes; none after). All together, the round's start against its end as
 * reports alternating in one process (300 each, four runs, both orders, machine load 3–7),
 * median CPU ms: full report with plans, spectra to 5000: 6.41–8.29 → 5.83–7.63, 8–13 % less
 * run by run (lower quartile 5.64–6.95 → 5.15–6.24); without plans 8.63–9.91 → 7.15–8.51; with
 * plans at the default order 3.34–4.18 → 2.67–3.50 (16–20 % less); the spectrum alone the same
 * in both (0.76–0.83). Instructions (callgrind, 40 reports
 * with plans and the process's start-up and compilation): 16.2–19.0 → 11.8–13.6 G. Allocation
 * per report 8.0 → 5.3 MB (sampling heap profile; 2.8 MB of it the five labelled spectra of the
 * answer). Profile after (quiet moment): the legs' exact sums 11–14 %, the transforms 9–11 %
 * (+2 % the DC link's real transform), labelling the five spectra 7–12 %, garbage collection
 * 6–10 % (V8 pretenures the labelled objects' allocation sites in long runs, so old-space
 * collections follow), the per-sample figures 4 %. Measured and left out: a faster atan2 path
 * for the spectra's zero orders (atan2 of zeros is already fast: no difference). Seen and left:
 * legLossesFromSamples and currentExtremes can fall into the same deoptimisation loop (their
 * results are built after their loops from many sums; building them before would cost a store
 * per sample), seen in 2 of 10 processes. The 5 ms goal is still not reached at spectra to 5000
 * in the median under load (the lower quartile is near it); the default order is well under it.
 *
 * Fifth round (each step bit-identical on the 40-design corpus, with and without plans, compare
 * limit 0): legLossesFromSamples and a filtered phase's currentExtremes have their loops as the
 * last thing in a function of their own, summing into or writing to an array built before the
 * loop (V8's on-stack-replacement code had deoptimised at the result built after the loop at
 * every later call: 181 times in 40 reports in 1 of 8 processes; none in 10 after); a filtered
 * report's sampled currents and output samples live in sample buffers its synthesiser keeps a
 * phase (`PeriodSynthesiser.buffers`), so with plans they are reused from report to report (typed
 * arrays allocated a report 3.33 → 2.41 MB; a test checks that a report keeps copies only).
 * The round's start against its end, 300–400 reports alternating in one process, six runs at
 * load 2–5, median CPU ms with plans to 5000: 6.63/7.33/6.60/6.17/7.88/7.39 → 6.94/6.97/6.97/
 * 6.36/7.65/7.07, i.e. within the machine's noise, three runs each way; default order 3.26–3.41
 * → 3.24–3.40. Measured and left: labelling a 5001-order spectrum is about 80–115 µs (the 2501
 * exactly-zero orders' arc tangents 20 µs of it, the objects 30–40 µs: no bit-identical cut
 * worth its code); the legs' exact sums already rotate e^{−jnθ} with a fresh sin/cos every 256
 * orders, and a two-term (Chebyshev, Goertzel-like) recurrence, the next cheaper step, loses
 * accuracy near θ = 0 and π (its rounding grows as n/sin θ: W. M. Gentleman, 1969, on Goertzel's
 * method; from memory), so they stay; validating the loss cells (assertFiniteArray, 1.2 % of a profile) and the
 * DC link's and running integral's remaining S-sample arrays (about 1 % each) are left. Profile
 * after (300 reports, one process): exact sums 13 %, transforms 11 % (+2 % real), garbage
 * collection 7 %, labelling 6 % (13 % in another process of the same build). That spread was
 * V8's allocation-site pretenuring: the labelled orders were object literals, whose site V8
 * tracks, and in most processes (9 of 14 seen) it moved them to the old generation, so 300
 * reports took 39–47 minor and 19–22 major collections instead of 100–113 and 1
 * (`--no-allocation-site-pretenuring` alone: median of seven processes 5.95 → 5.56 ms). The
 * labeller now builds them with a constructor (same fields, order and JSON): never pretenured
 * in 11 processes (100–151 minor, 1 major). Mean CPU a report over 300, separate processes at
 * load 3–4: round start 8.50–10.68 ms where pretenured, 5.40–7.16 where not; after, 5.40–9.40
 * (six of eight 5.4–7.1); the median of a process moves less (the major collections hit a few
 * reports), 4.82–5.75 → 4.61–6.93 in four pairs. bench/design-report.ts after, two runs at load
 * 2.9–3.1: plans row 5.91 and 5.62 ms (spectrum alone 1.06–1.08, the runs before this step at
 * load 2.2–2.7: 7.49–8.82). The 5 ms goal is still not reached in the median at spectra to 5000
 * on this shared machine; it is within reach of the lower quartile (4.4–5.4 ms).
 *
 * Sixth round (bit-identical: a 132-design corpus of every method and zero sequence, with and
 * without load, filter, grid, device and back-EMF, at mf 21, 45 and 101, the default order and
 * 5000, each report without plans and twice on shared plans, serialised with its signed zeros,
 * the same before and after each step): no product or label formed that nothing reads. The
 * labeller shares one entry per exactly-zero order and sign pair of its zero parts among the
 * spectra it labels (about half the orders of a half-wave-symmetric design's bridge, line,
 * common-mode and filter-output spectra: 10000 fewer objects a report with plans), a sign pair's
 * table built when its first zero comes; phases b and c are combined from the legs and solved
 * through the network to the current order (1020) only, only phase a's output voltage is formed,
 * to its spectrum order, and the network's unit responses keep their currents to the current
 * order (16 arrays of 5001 orders → 1021, and phases b and c's four output arrays no longer
 * formed). Instructions a report at mf 101 to 5000
 * (callgrind, `node --single-threaded`, slope from 40 to 100 reports): with plans 90.8 → 88.6
 * (first step) → 86.1 M, 5 % fewer; without plans 110.1 → 102.0 M, 7 % fewer. Processes in turn,
 * 300 reports with plans each, median CPU ms a process, eight pairs twice at load 2.5 (one core
 * busy with callgrind): 4.36–5.99 → 4.14–6.27 (median of the medians 5.06 → 4.55) and 4.92–7.89
 * → 4.28–6.79 (5.93 → 5.24); as the bench runs them (200 reports without plans, then 200 with
 * plans in the same process), three pairs: with plans 5.62/6.10/4.69 → 5.01/4.71/4.60, without
 * 7.38/6.53/7.85 → 6.47/6.05/5.67. Alternating in one process (both builds sharing one heap, so
 * the collector's gain is shared too): within the noise. Garbage collection 8 → 5 % of a CPU
 * profile of 400 reports. Measured and left: the loss cells' finiteness check given a loop of its
 * own for a Float64Array (no gain: 65 and 64 µs for the three legs' cells); the legs' last, padded
 * group of four edges (0.4 % of the instructions); the legs' exactly-zero even orders in the
 * combinations and network products (a bit-identical skip must reproduce each zero's sign: under
 * 1 %). Profile after: the legs' exact sums 14 % (four edges' rotations an order, near the
 * floating-point units' throughput: what is left there changes rounding), fft.js's transforms
 * 14 %, labelling the non-zero orders (a square root, an arc tangent and an object each) 8 %,
 * garbage collection 5 %, the per-sample extremes 5 %, the modulator and waveforms 10 %, the DC
 * link 8 %, losses 7 %. bench/design-report.ts after, three runs at load 0.5–0.9 (spectrum alone
 * 0.93–1.04 ms; 0.89 on the quiet morning when the round's start gave 4.78–5.10): plans row 7.05,
 * 5.80 and 8.40 ms; the bench against the builds of the round's start and end in turn, three
 * pairs at load 0.8: plans row 6.46/5.12/5.75 → 5.05/5.26/5.55 ms, full report at the default
 * order 4.70/4.43/4.73 → 4.08/4.06/6.07. The 5 ms goal is still not reached reliably at spectra
 * to 5000 on this machine: the round's 5–7 % is smaller than its run-to-run spread, and what is
 * left is the exact sums, the transforms and the answer's own labelled objects.
 *
 * Seventh round (figures equal to rounding on a 584-report corpus of every method and zero
 * sequence at mf 21, 45, 100 and 101 and a span, with and without load, filter, device and
 * back-EMF, at the default order and 5000: the largest change 2e-10 of a figure, in the ripple RMS
 * after its tail's cancellation, and values that were rounding noise, 1e-16–1e-14, moved within
 * it): mirror symmetry. A waveform that is its own mirror image about π/2 or 0 (leg a under
 * carrier PWM, a single-phase bridge) is summed over one edge of each orbit of its symmetries (a
 * quarter of the edges with half-wave symmetry), the other part of each order exactly zero; leg c,
 * leg b read backwards, takes leg b's phasors with signs changed (`waveformMirror`,
 * `mirroredPhasors`): the legs' sums 3 → 1.5 legs' worth, and the spectrum alone 0.93 → 0.60 ms.
 * The bridge and line THD and WTHD read the waveform's own fundamental once for both, not once
 * each, and a fundamental's sum skips the step rotation's trigonometry (reading it from the
 * report's leg-combined spectrum instead, tried first, differed from POST /spectra's by rounding:
 * one voltage must get one whole-waveform THD from every route). The filter output's chart series,
 * which no figure reads, is synthesised on a grid of its own of about twice the chart's points
 * (4096 samples, not the currents' 16384: one 16384-sample transform fewer). The conduction cells
 * are summed without `assertFiniteArray`'s passes (`legLossesOfValidSamples`: two passes over 8192
 * cells a leg fewer) and the running integral's samples take a multiplication for a division.
 * Instructions a full report with plans (callgrind, node --single-threaded, slope from 50 to 250
 * reports, two runs each; the slope from 40 to 100 moved by ±3 M run to run): 86.5/87.8 →
 * 77.1/76.4 M, 12–13 % fewer. Reports alternating with the round's start in one process, median
 * CPU ms with plans: 5.16/5.51 → 4.77/4.96 after the first step, 4.86/5.44 → 4.22/4.99 after the
 * second (quiet moments), and 5.97–7.25 → 5.21–6.33 later when the same code ran a third slower
 * throughout (the host's state: load under 1, no steal counted), and 6.50/7.28 → 5.93/6.40 at the
 * round's end in that state, the bench's plans row 5.01 and 6.84 ms; when the host was quick again
 * (12:55, load 0.2–0.5) the round's start against its end alternating, 4.66 → 4.11 ms, and four
 * bench runs' plans row 4.07, 4.52, 5.08 and 4.67 ms (spectrum alone 0.49–0.68 ms). The plans row
 * now runs 100 reports after 30, the goal's row, for a steadier median. Measured and left: the
 * finiteness check split by array kind (no fewer instructions); fft.js on plain arrays against
 * Float64Arrays (within the noise). Profile after: fft.js's transforms 14 %, labelling 9 %, the
 * legs' sums 7 %, the filtered phases' per-sample extremes 6 %, garbage collection 5 %.
 *
 * Eighth round (figures equal to rounding on a 3004-report corpus of every method and zero
 * sequence at mf 21, 45, 100, 101 and a span ratio 40.5, with and without load, filter (both
 * damping kinds), device and back-EMF, at the default order and 5000, with and without plans:
 * the largest change 4.5e-11 of a cascaded cell's power, a residue of cancelling products, and
 * 3.1e-13 of a device's conduction): half-wave symmetry of the sampled series. Currents whose
 * even orders are all zero (carrier PWM at odd mf) are synthesised through a transform of S/2
 * (the odd orders' inverse DFT times a twiddle; the second half is the first negated, written
 * from the same loop) and their extremes read over the first half; the DC-link current of
 * half-wave symmetric legs and currents repeats each half period, so its first half is sampled
 * and transformed and its odd orders are exactly zero (2500 fewer arc tangents and labelled
 * objects a report); a half-wave symmetric leg's conduction cells are summed over the first half
 * (half a period on, the upper device conducts as the lower did). The plans keep six grid sizes
 * (each grid and its half), and a report without plans makes plans of its own. Instructions a
 * full report with plans (callgrind, node --single-threaded, slope from 50 to 250 reports):
 * 76.5 → 67.4 (synthesis, extremes and DC link) → 63.3 M (losses), 17 % fewer. Reports
 * alternating with the round's start in one process, median CPU ms with plans: 6.06 → 5.07
 * after the first step and 6.11 → 5.08 at the end (a slow spell of the host). The plans row
 * alone, six processes of 300 reports: 3.87–3.97 ms in five, 5.16 in one; the bench's sequence
 * of rows in plain node, eight runs: plans row 4.50, 4.89, 3.63, 3.39, 5.30, 6.08, 5.46 and
 * 4.16 ms; this bench (tsx), fourteen runs: 4.24, 3.54, 5.72, 7.19, 4.53, 4.00, 5.53, 5.24, 4.97,
 * 4.34, 5.07, 4.17, 4.56 and 3.93 ms, median about 4.55 ms (spectrum alone 0.50–1.04 ms; a run
 * can read 7.19 ms with the spectrum at 0.52: the report, memory bound, spreads more than the
 * cache-resident spectrum on this shared host). Under 5 ms in the median, not in every run.
 * Profile after:
 * labelling the five spectra 10 % (an arc tangent and an object an order, the answer itself),
 * the legs' exact sums 9 %, garbage collection 7 %, fft.js's transforms 8 %, the extremes 4 %.
 *
 * Ninth round (bit for bit the same reports on the 3004-report corpus): the phase, line and
 * common-mode voltages from one merge of the three legs' edges (`starVoltages`, seven waveforms
 * that were seven merges), the canonical form of a waveform in one pass, and the modulator's
 * transitions put in order without array maps: 62.5 → 60.1 M instructions a full report with
 * plans (callgrind), threePhase at mf 101 355–373 → 290–302 µs. The host was quick all session:
 * the round's start and its end, eight processes each in turn, plans row median 3.36 and 3.30 ms
 * (2.84–3.91 and 2.88–3.97), the same to the noise; this bench, nine runs: plans row 3.05, 3.32,
 * 3.41, 4.49, 3.78, 3.42, 4.36, 3.46 and 3.66 ms (spectrum alone 0.50–0.78 ms), every run under
 * 5 ms; the full report without plans (each call building its own fft.js tables) 4.64–6.98 ms
 * in the three runs that printed it. Scavenges: one every 3.3 reports, 1.1 ms each (0.34 ms a
 * report on the mean; the median report has none).
 */
import {
  analyseDesign,
  harmonics,
  modulationVoltages,
  designModulation,
  designReportPlans,
  type InverterDesign,
  EXAMPLE_IGBT,
} from '@pulsewright/modulation';
import { medianCpuTime, printTable } from './measure.js';

const mf = 101;
const unfiltered: InverterDesign = {
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * mf,
  modulation: { method: 'three-phase', ma: 1.0, zeroSequence: 'min-max' },
  load: { r: 16, l: 0.03 },
};
const filtered: InverterDesign = { ...unfiltered, filter: { l: 0.002, c: 10e-6, rDamping: 3 } };
const full: InverterDesign = { ...filtered, device: { ...EXAMPLE_IGBT } };

const phase = modulationVoltages(designModulation(unfiltered)).phases[0]?.waveform;
if (!phase) throw new Error('no phase voltage');
const spectrumOnly = medianCpuTime(() => harmonics(phase, 50 * mf), 50, 20);
const reportUnfiltered = medianCpuTime(
  () => analyseDesign(unfiltered, { maxOrder: 5000, points: 1200 }),
  30,
  10,
);
const reportFiltered = medianCpuTime(
  () => analyseDesign(filtered, { maxOrder: 5000, points: 1200 }),
  30,
  10,
);
const reportDefault = medianCpuTime(() => analyseDesign(filtered), 30, 10);
const reportFull = medianCpuTime(
  () => analyseDesign(full, { maxOrder: 5000, points: 1200 }),
  30,
  10,
);
const reportFullDefault = medianCpuTime(() => analyseDesign(full), 30, 10);
// The same with the caller's transform plans, as a compute worker keeps them.
const plans = designReportPlans();
const reportFullPlanned = medianCpuTime(
  () => analyseDesign(full, { maxOrder: 5000, points: 1200, plans }),
  100,
  30,
);

printTable(
  `Design report, three-phase, mf ${mf} (median CPU ms; ratios against the spectrum alone in the same run)`,
  [
    ['exact spectrum of the phase voltage to 50·mf', `${spectrumOnly.toFixed(2)} ms (1.00)`],
    [
      'report, load, no filter, spectra to 5000',
      `${reportUnfiltered.toFixed(2)} ms (${(reportUnfiltered / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'report, load and LC filter, spectra to 5000',
      `${reportFiltered.toFixed(2)} ms (${(reportFiltered / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'report, load and LC filter, default spectrum order',
      `${reportDefault.toFixed(2)} ms (${(reportDefault / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'full report: load, LC filter, losses, spectra to 5000',
      `${reportFull.toFixed(2)} ms (${(reportFull / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'full report: load, LC filter, losses, default spectrum order',
      `${reportFullDefault.toFixed(2)} ms (${(reportFullDefault / spectrumOnly).toFixed(1)}×)`,
    ],
    [
      'full report, spectra to 5000, transform plans kept between reports',
      `${reportFullPlanned.toFixed(2)} ms (${(reportFullPlanned / spectrumOnly).toFixed(1)}×)`,
    ],
    ['issue 12 goal for the full report', '5 ms'],
  ],
);
